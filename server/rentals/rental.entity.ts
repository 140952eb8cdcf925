import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Quote } from '../../shared/billing/views';
import { OrgOwned } from '../db/org-owned';
import { Customer } from './customer.entity';

/** A booking for a customer at the prices quoted when it was made (DESIGN.md §3). Dates live on the booking. */
@Entity({ name: 'rentals' })
@Index(['organizationId', 'number'], { unique: true })
@Index(['organizationId', 'customerId'])
export class Rental extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  number: string;

  @Column({ name: 'customer_id', type: 'uuid' })
  customerId: string;

  @ManyToOne(() => Customer, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'customer_id' })
  customer?: Customer;

  @Index({ unique: true })
  @Column({ name: 'booking_id', type: 'uuid' })
  bookingId: string;

  // The bookings component's row, named rather than imported: rentals read it through server/bookings.
  @ManyToOne('Booking', { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'booking_id' })
  booking?: object;

  /** The prices agreed: kept as quoted, whatever the rate cards say later. */
  @Column({ type: 'jsonb' })
  quote: Quote;

  @Column({ name: 'deposit_minor', type: 'integer' })
  depositMinor: number;

  @Column({ type: 'text' })
  currency: string;

  /** The customer's card saved with the provider when the deposit was first authorized, for renewals and charges above the authorization. */
  @Column({ name: 'payment_method_id', type: 'text', nullable: true })
  paymentMethodId: string | null;

  @Column({ type: 'text', nullable: true })
  note: string | null;

  /** The owner let the kit go without the accepted agreement or the card authorization: why, who, when (audited too). */
  @Column({ name: 'handover_override_reason', type: 'text', nullable: true })
  handoverOverrideReason: string | null;

  @Column({ name: 'handover_override_by', type: 'uuid', nullable: true })
  handoverOverrideBy: string | null;

  @Column({ name: 'handover_override_at', type: 'timestamptz', nullable: true })
  handoverOverrideAt: Date | null;

  @Column({ name: 'created_by', type: 'uuid' })
  createdBy: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
