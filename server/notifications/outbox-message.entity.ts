import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import { OrgOwned } from '../db/org-owned';

export type OutboxStatus = 'pending' | 'sent' | 'failed';

/** An e-mail waiting to go out. Written in the same transaction as the change
 * that caused it; the outbox sender delivers it with retries. */
@Entity({ name: 'outbox_messages' })
@Index(['status', 'nextAttemptAt'])
export class OutboxMessage extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** RFC 5322 Message-ID, fixed at enqueue so a retried delivery is recognisable. */
  @Index({ unique: true })
  @Column({ name: 'message_id', type: 'text' })
  messageId: string;

  @Column({ type: 'text', array: true })
  recipients: string[];

  /** The firm's name as the From display name, as it was when the mail was queued ('' before the firm spoke for itself). */
  @Column({ name: 'from_name', type: 'text', default: '' })
  fromName: string;

  /** The firm's contact for replies when the mail was queued (null: none set). */
  @Column({ name: 'reply_to', type: 'text', nullable: true })
  replyTo: string | null;

  @Column({ type: 'text' })
  subject: string;

  @Column({ name: 'text_body', type: 'text' })
  textBody: string;

  @Column({ name: 'html_body', type: 'text' })
  htmlBody: string;

  @Column({ type: 'text', default: 'pending' })
  status: OutboxStatus;

  @Column({ type: 'integer', default: 0 })
  attempts: number;

  @Column({ name: 'next_attempt_at', type: 'timestamptz', default: () => 'now()' })
  nextAttemptAt: Date;

  @Column({ name: 'last_error', type: 'text', nullable: true })
  lastError: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true })
  sentAt: Date | null;
}
