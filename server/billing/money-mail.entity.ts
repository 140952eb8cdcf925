import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { MoneyMailEvent } from '../../shared/billing/views';
import { OrgOwned } from '../db/org-owned';

/**
 * A change to the customer's money (capture, release, invoice, credit note) and the outbox mail that told them, written in
 * the change's transaction: the rental page says what happened and when the mail went.
 */
@Entity({ name: 'money_mails' })
@Index(['organizationId', 'rentalId'])
export class MoneyMail extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'rental_id', type: 'uuid' })
  rentalId: string;

  // Rentals' row, named rather than imported: billing reads rentals through server/rentals.
  @ManyToOne('Rental', { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'rental_id' })
  rental?: object;

  @Column({ type: 'text' })
  event: MoneyMailEvent;

  /** The outbox message (notifications' row, read through its index). */
  @Column({ name: 'outbox_message_id', type: 'uuid' })
  outboxMessageId: string;

  @Column({ name: 'captured_minor', type: 'integer', default: 0 })
  capturedMinor: number;

  @Column({ name: 'released_minor', type: 'integer', default: 0 })
  releasedMinor: number;

  @Column({ name: 'charged_minor', type: 'integer', default: 0 })
  chargedMinor: number;

  @Column({ name: 'document_number', type: 'text', nullable: true })
  documentNumber: string | null;

  @Column({ name: 'total_minor', type: 'integer', nullable: true })
  totalMinor: number | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
