import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { AsFound, IntervalChange } from '../../shared/calibration/interval-review';
import { OrgOwned } from '../db/org-owned';
import { AssetBound } from '../fleet';

/** A certificate PDF, kept in PostgreSQL so every app instance can serve it. */
@Entity({ name: 'certificate_files' })
export class CertificateFile extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'file_name', type: 'text' })
  fileName: string;

  @Column({ name: 'size_bytes', type: 'integer' })
  sizeBytes: number;

  @Column({ type: 'bytea', select: false })
  data: Buffer;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}

/** One calibration of one item (DESIGN.md §3): the lab's certificate and what it found. */
@Entity({ name: 'calibration_events' })
@Index(['organizationId', 'assetId', 'performedOn'])
export class CalibrationEvent extends AssetBound {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'performed_on', type: 'date' })
  performedOn: string;

  @Column({ type: 'text' })
  provider: string;

  @Column({ name: 'certificate_number', type: 'text' })
  certificateNumber: string;

  @Column({ name: 'certificate_file_id', type: 'uuid' })
  certificateFileId: string;

  @ManyToOne(() => CertificateFile, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'certificate_file_id' })
  certificateFile?: CertificateFile;

  @Column({ name: 'as_found', type: 'text' })
  asFound: AsFound;

  /** The largest as-found error the certificate states (µm), when it states one: impact triage weighs it against each job's tolerance. */
  @Column({ name: 'as_found_error_um', type: 'double precision', nullable: true })
  asFoundErrorUm: number | null;

  @Column({ name: 'as_left', type: 'text' })
  asLeft: AsFound;

  /** The interval this calibration was given, and the due date it produced. */
  @Column({ name: 'interval_months', type: 'integer' })
  intervalMonths: number;

  @Column({ name: 'due_on', type: 'date' })
  dueOn: string;

  @Column({ name: 'suggested_interval_months', type: 'integer' })
  suggestedIntervalMonths: number;

  @Column({ name: 'suggestion_reason', type: 'text' })
  suggestionReason: string;

  /** Which way the suggestion moves, or `outside_policy` when the interval is outside the firm's range and left to a person. */
  @Column({ name: 'suggested_change', type: 'text' })
  suggestedChange: IntervalChange;

  /** The owner's answer to the suggestion; null while open or when it suggested no change. */
  @Column({ name: 'interval_decision', type: 'text', nullable: true })
  intervalDecision: 'accepted' | 'declined' | null;

  @Column({ name: 'lab_trip_id', type: 'uuid', nullable: true })
  labTripId: string | null;

  @Column({ type: 'text', nullable: true })
  note: string | null;

  @Column({ name: 'recorded_by', type: 'uuid' })
  recordedBy: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
