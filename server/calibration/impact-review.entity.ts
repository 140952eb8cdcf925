import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { OrgOwned } from '../db/org-owned';
import type { TriageFacts } from '../../shared/calibration/triage';
import type { ImpactAssessment } from '../../shared/calibration/views';
import { AssetBound } from '../fleet';

/**
 * The out-of-tolerance impact review (ISO 9001:2015 §7.1.5.2, ISO/IEC
 * 17025:2017 §7.10): every booking that used the item between its last
 * passing evidence and the finding, each to be assessed.
 */
@Entity({ name: 'impact_reviews' })
@Index(['organizationId', 'state'])
@Index(['organizationId', 'assetId'])
export class ImpactReview extends AssetBound {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  trigger: 'calibration' | 'check';

  @Column({ name: 'trigger_id', type: 'uuid' })
  triggerId: string;

  /** Day of the last passing evidence (null: none on record, so every earlier use counts). */
  @Column({ type: 'date', nullable: true })
  since: string | null;

  @Column({ name: 'found_on', type: 'date' })
  foundOn: string;

  @Column({ type: 'text', default: 'open' })
  state: 'open' | 'closed';

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'closed_at', type: 'timestamptz', nullable: true })
  closedAt: Date | null;
}

@Entity({ name: 'impact_review_items' })
@Index(['reviewId', 'bookingId'], { unique: true })
export class ImpactReviewItem extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'review_id', type: 'uuid' })
  reviewId: string;

  @ManyToOne(() => ImpactReview, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'review_id' })
  review?: ImpactReview;

  @Column({ name: 'booking_id', type: 'uuid' })
  bookingId: string;

  @Column({ type: 'text', nullable: true })
  assessment: ImpactAssessment | null;

  @Column({ type: 'text', nullable: true })
  note: string | null;

  @Column({ name: 'assessed_by', type: 'uuid', nullable: true })
  assessedBy: string | null;

  @Column({ name: 'assessed_at', type: 'timestamptz', nullable: true })
  assessedAt: Date | null;

  /** The triage shown when the booking was assessed: numbers, ratio and rule, for the auditor. */
  @Column({ type: 'jsonb', nullable: true })
  triage: TriageFacts | null;

  @Column({ name: 'notice_queued_at', type: 'timestamptz', nullable: true })
  noticeQueuedAt: Date | null;

  /** The outbox message of the notice this booking's customer was sent (its delivery time answers "when did it go"). */
  @Column({ name: 'notice_message_id', type: 'uuid', nullable: true })
  noticeMessageId: string | null;
}
