import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import { OrgOwned } from '../db/org-owned';

/** Append-only record of who changed what (ISO/IEC 17025 §6.4 records). The
 * database refuses UPDATE and DELETE on this table (see the migration). */
@Entity({ name: 'audit_events' })
@Index(['organizationId', 'subjectType', 'subjectId'])
export class AuditEvent extends OrgOwned {
  @PrimaryGeneratedColumn('identity', { type: 'bigint' })
  id: string;

  @Column({ name: 'actor_user_id', type: 'uuid', nullable: true })
  actorUserId: string | null;

  @Column({ type: 'text' })
  action: string;

  @Column({ name: 'subject_type', type: 'text' })
  subjectType: string;

  @Column({ name: 'subject_id', type: 'text' })
  subjectId: string;

  @Column({ type: 'jsonb' })
  details: Record<string, unknown> = {};

  @CreateDateColumn({ name: 'at', type: 'timestamptz' })
  at: Date;
}
