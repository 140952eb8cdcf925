import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import type { RoutineRunStatus } from '../../shared/routines/views';

// Tables and the name column keep their first names (job_…): instances still on the old version during a
// rolling update keep claiming and logging in the same tables, so no fire runs twice.

/** One execution of a routine, on whichever instance won the fire. */
@Entity({ name: 'job_runs' })
@Index(['routineName', 'startedAt'])
export class RoutineRun {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'job_name', type: 'text' })
  routineName: string;

  @Column({ type: 'text' })
  trigger: 'schedule' | 'manual';

  /** The cron slot this run answers; null for a manual run. */
  @Column({ name: 'scheduled_for', type: 'timestamptz', nullable: true })
  scheduledFor: Date | null;

  @Column({ name: 'instance_id', type: 'text' })
  instanceId: string;

  @Column({ name: 'started_at', type: 'timestamptz' })
  startedAt: Date;

  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true })
  finishedAt: Date | null;

  @Column({ type: 'text' })
  status: RoutineRunStatus;

  @Column({ type: 'jsonb', nullable: true })
  summary: Record<string, unknown> | null;

  @Column({ type: 'text', nullable: true })
  error: string | null;

  /** The firm a manual run was limited to; null for a scheduled run over every firm. */
  @Column({ name: 'organization_id', type: 'uuid', nullable: true })
  organizationId: string | null;
}

/** A claim on one cron slot: the first instance to insert the key runs it. */
@Entity({ name: 'job_leases' })
export class RoutineLease {
  @Column({ type: 'text', primary: true })
  key: string;

  @Column({ name: 'instance_id', type: 'text' })
  instanceId: string;

  @Column({ name: 'claimed_at', type: 'timestamptz' })
  claimedAt: Date;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;
}
