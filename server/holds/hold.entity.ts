import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { HoldReason, HoldReleaseEvidence } from '../../shared/holds/views';
import { AssetBound } from '../fleet';

/** An asset taken out of service (ISO/IEC 17025:2017 §6.4.9). It ends only by a
 * release on evidence recorded after it began. */
@Entity({ name: 'holds' })
@Index(['organizationId', 'assetId'], { unique: true, where: '"released_at" IS NULL' })
export class Hold extends AssetBound {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  reason: HoldReason;

  @Column({ type: 'text' })
  summary: string;

  @Column({ name: 'incident_id', type: 'uuid', nullable: true })
  incidentId: string | null;

  @Column({ name: 'check_id', type: 'uuid', nullable: true })
  checkId: string | null;

  @Column({ name: 'started_at', type: 'timestamptz' })
  startedAt: Date;

  @Column({ name: 'started_by', type: 'uuid' })
  startedBy: string;

  @Column({ name: 'released_at', type: 'timestamptz', nullable: true })
  releasedAt: Date | null;

  @Column({ name: 'released_by', type: 'uuid', nullable: true })
  releasedBy: string | null;

  /** What the release rested on: the passing checks or calibration that cleared it. */
  @Column({ name: 'release_evidence', type: 'jsonb', nullable: true })
  releaseEvidence: HoldReleaseEvidence | null;
}
