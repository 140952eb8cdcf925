import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { JobTolerance } from '../../shared/calibration/triage';
import { OrgOwned } from '../db/org-owned';

/** A customer site job of the firm's own (DESIGN.md §3). */
@Entity({ name: 'jobs' })
@Index(['organizationId', 'reference'], { unique: true })
export class Job extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  reference: string;

  @Column({ name: 'customer_name', type: 'text' })
  customerName: string;

  @Column({ name: 'contact_name', type: 'text', nullable: true })
  contactName: string | null;

  @Column({ name: 'contact_email', type: 'text', nullable: true })
  contactEmail: string | null;

  @Column({ name: 'site_address', type: 'text', nullable: true })
  siteAddress: string | null;

  @Column({ name: 'starts_on', type: 'date' })
  startsOn: string;

  @Column({ name: 'ends_on', type: 'date' })
  endsOn: string;

  @Column({ name: 'lead_technician_id', type: 'uuid', nullable: true })
  leadTechnicianId: string | null;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  /** The tightest feature tolerance the job measured, if recorded: what an impact review weighs an instrument's error against. */
  @Column({ name: 'tightest_tolerance', type: 'jsonb', nullable: true })
  tightestTolerance: JobTolerance | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
