import { Column, CreateDateColumn, Entity, Exclusion, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { ChecklistLine } from '../../shared/bookings/views';
import type { BookingPurpose, BookingState } from '../../shared/schemas/bookings';
import { OrgOwned } from '../db/org-owned';
import type { AssetRecord, KitRecord } from '../fleet';
import { Job } from './job.entity';

/** Assets (or a kit) reserved for whole days, `startsOn`..`endsOn` inclusive. */
@Entity({ name: 'bookings' })
@Index(['organizationId', 'startsOn', 'endsOn'])
@Index(['organizationId', 'state'])
export class Booking extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'starts_on', type: 'date' })
  startsOn: string;

  @Column({ name: 'ends_on', type: 'date' })
  endsOn: string;

  @Column({ type: 'text', default: 'reserved' })
  state: BookingState;

  @Column({ type: 'text' })
  purpose: BookingPurpose;

  @Column({ name: 'job_id', type: 'uuid', nullable: true })
  jobId: string | null;

  @ManyToOne(() => Job, { onDelete: 'RESTRICT', nullable: true })
  @JoinColumn({ name: 'job_id' })
  job?: Job | null;

  /** Set by the rentals component. */
  @Column({ name: 'rental_id', type: 'uuid', nullable: true })
  rentalId: string | null;

  @Column({ name: 'kit_id', type: 'uuid', nullable: true })
  kitId: string | null;

  @ManyToOne('Kit', { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'kit_id' })
  kit?: KitRecord | null;

  @Column({ type: 'text', nullable: true })
  note: string | null;

  /** Past use the owner recorded (never reserved or handed over in Nestkeeper); marked as such wherever it shows. */
  @Column({ type: 'boolean', default: false })
  history: boolean;

  @Column({ name: 'created_by', type: 'uuid' })
  createdBy: string;

  @Column({ name: 'checked_out_at', type: 'timestamptz', nullable: true })
  checkedOutAt: Date | null;

  @Column({ name: 'handed_over_by', type: 'uuid', nullable: true })
  handedOverBy: string | null;

  /** Who took the kit: a name as said at the counter, and the user when it is one of the firm's people. */
  @Column({ name: 'taken_by', type: 'text', nullable: true })
  takenBy: string | null;

  @Column({ name: 'taken_by_user_id', type: 'uuid', nullable: true })
  takenByUserId: string | null;

  /** Why the kit went before its checkout window opened, or late after it was not collected. */
  @Column({ name: 'checkout_note', type: 'text', nullable: true })
  checkoutNote: string | null;

  @Column({ name: 'checkout_checklist', type: 'jsonb', nullable: true })
  checkoutChecklist: ChecklistLine[] | null;

  @Column({ name: 'returned_at', type: 'timestamptz', nullable: true })
  returnedAt: Date | null;

  @Column({ name: 'received_by', type: 'uuid', nullable: true })
  receivedBy: string | null;

  @Column({ name: 'brought_back_by', type: 'text', nullable: true })
  broughtBackBy: string | null;

  @Column({ name: 'return_checklist', type: 'jsonb', nullable: true })
  returnChecklist: ChecklistLine[] | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}

/**
 * One asset of a booking, with the booking's dates copied so the database can
 * refuse two active bookings of the same asset on the same day — under any
 * race — with an exclusion constraint on inclusive date ranges.
 */
@Entity({ name: 'booking_items' })
@Exclusion('booking_items_no_double_booking', `USING gist ("asset_id" WITH =, daterange("starts_on", "ends_on", '[]') WITH &&) WHERE ("active")`)
@Index(['organizationId', 'assetId', 'startsOn'])
@Index(['bookingId'])
export class BookingItem extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'booking_id', type: 'uuid' })
  bookingId: string;

  @ManyToOne(() => Booking, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'booking_id' })
  booking?: Booking;

  // (asset, ends_on) of active rows only: "is this asset free then?" probed per asset; made by AvailabilityIndexes.
  @Index('booking_items_active_by_asset', { synchronize: false })
  @Column({ name: 'asset_id', type: 'uuid' })
  assetId: string;

  @ManyToOne('Asset', { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'asset_id' })
  asset?: AssetRecord;

  @Column({ name: 'starts_on', type: 'date' })
  startsOn: string;

  @Column({ name: 'ends_on', type: 'date' })
  endsOn: string;

  /** False once the booking is returned or cancelled: it no longer holds the dates. */
  @Column({ type: 'boolean', default: true })
  active: boolean;
}
