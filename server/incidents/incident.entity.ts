import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { IncidentKind, IncidentState } from '../../shared/schemas/incidents';
import { OrgOwned } from '../db/org-owned';
import { AssetBound } from '../fleet';

/** A damage or loss report (DESIGN.md §3). Reporting one holds the asset. */
@Entity({ name: 'incidents' })
@Index(['organizationId', 'state'])
@Index(['organizationId', 'assetId'])
export class Incident extends AssetBound {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  kind: IncidentKind;

  @Column({ type: 'text' })
  description: string;

  @Column({ name: 'occurred_at', type: 'timestamptz' })
  occurredAt: Date;

  @Column({ type: 'text', nullable: true })
  location: string | null;

  @Column({ name: 'booking_id', type: 'uuid', nullable: true })
  bookingId: string | null;

  /** The customer of the job or rental the item came back from (set at return). */
  @Column({ name: 'customer_name', type: 'text', nullable: true })
  customerName: string | null;

  @Column({ type: 'text', default: 'reported' })
  state: IncidentState;

  @Column({ type: 'text', nullable: true })
  resolution: string | null;

  /** What the firm will charge someone for it, in minor units of the firm's currency. */
  @Column({ name: 'charge_amount_minor', type: 'integer', nullable: true })
  chargeAmountMinor: number | null;

  @Column({ name: 'reported_by', type: 'uuid' })
  reportedBy: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}

/** A photo of the damage. Stored in PostgreSQL under a random id; served only
 * through the incident's organization-scoped route. */
@Entity({ name: 'incident_photos' })
export class IncidentPhoto extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ name: 'incident_id', type: 'uuid' })
  incidentId: string;

  @ManyToOne(() => Incident, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'incident_id' })
  incident?: Incident;

  @Column({ name: 'content_type', type: 'text' })
  contentType: string;

  @Column({ name: 'file_name', type: 'text' })
  fileName: string;

  @Column({ name: 'size_bytes', type: 'integer' })
  sizeBytes: number;

  @Column({ type: 'bytea', select: false })
  data: Buffer;

  /** A small JPEG for lists; null where the file could not be decoded. */
  @Column({ type: 'bytea', nullable: true, select: false })
  thumbnail: Buffer | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
