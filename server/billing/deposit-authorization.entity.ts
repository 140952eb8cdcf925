import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { AuthorizationState } from '../../shared/billing/views';
import { OrgOwned } from '../db/org-owned';

/**
 * One PaymentIntent for a rental: the deposit's card authorization
 * (`authorization`, manual capture) or a charge above it on the saved card
 * (`charge`). Declined attempts stay on record; a renewal marks the
 * authorization it replaced.
 */
@Entity({ name: 'deposit_authorizations' })
@Index(['organizationId', 'rentalId'])
@Index(['state', 'captureBefore'])
export class DepositAuthorization extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'rental_id', type: 'uuid' })
  rentalId: string;

  // Rentals' row, named rather than imported: billing reads rentals through server/rentals.
  @ManyToOne('Rental', { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'rental_id' })
  rental?: object;

  @Column({ type: 'text', default: 'authorization' })
  kind: 'authorization' | 'charge';

  @Index({ unique: true, where: '"payment_intent_id" IS NOT NULL' })
  @Column({ name: 'payment_intent_id', type: 'text', nullable: true })
  paymentIntentId: string | null;

  /** The Idempotency-Key the provider saw when this was created. */
  @Index({ unique: true })
  @Column({ name: 'idempotency_key', type: 'text' })
  idempotencyKey: string;

  @Column({ type: 'text' })
  state: AuthorizationState;

  @Column({ name: 'amount_minor', type: 'integer' })
  amountMinor: number;

  @Column({ name: 'captured_minor', type: 'integer', default: 0 })
  capturedMinor: number;

  @Column({ name: 'card_brand', type: 'text', nullable: true })
  cardBrand: string | null;

  @Column({ name: 'card_last4', type: 'text', nullable: true })
  cardLast4: string | null;

  @Column({ name: 'capture_before', type: 'timestamptz', nullable: true })
  captureBefore: Date | null;

  @Column({ name: 'initiated_by', type: 'text' })
  initiatedBy: 'customer' | 'merchant';

  @Column({ name: 'failure_message', type: 'text', nullable: true })
  failureMessage: string | null;

  @Column({ name: 'capture_reason', type: 'text', nullable: true })
  captureReason: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'settled_at', type: 'timestamptz', nullable: true })
  settledAt: Date | null;
}
