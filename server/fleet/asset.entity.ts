import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { Tolerance } from '../../shared/checks/tolerance';
import type { AssetStatus, AssetType } from '../../shared/schemas/assets';
import type { CheckKind } from '../../shared/schemas/check-kinds';
import { OrgOwned } from '../db/org-owned';
import { Kit } from './kit.entity';

/** bigint columns come back from pg as strings; money in minor units fits a JS number. */
const bigintAsNumber = { to: (v: number | null) => v, from: (v: string | null) => (v === null ? null : Number(v)) };

/** One serialized item of the fleet (DESIGN.md §3). */
@Entity({ name: 'assets' })
@Index(['organizationId', 'assetTag'], { unique: true })
@Index(['organizationId', 'rfidTag'], { unique: true, where: '"rfid_tag" IS NOT NULL' })
@Index(['organizationId', 'dueOn'])
@Index(['organizationId', 'type', 'status'])
export class Asset extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  type: AssetType;

  // (organization, type, in a kit or not, tag): the availability list's order, so it can stop at its limit; made by AvailabilityIndexes.
  @Index('assets_availability_order', { synchronize: false })
  @Column({ name: 'asset_tag', type: 'text' })
  assetTag: string;

  @Column({ name: 'serial_number', type: 'text' })
  serialNumber: string;

  @Column({ type: 'text', nullable: true })
  manufacturer: string | null;

  @Column({ type: 'text', nullable: true })
  model: string | null;

  @Column({ name: 'firmware_version', type: 'text', nullable: true })
  firmwareVersion: string | null;

  @Column({ name: 'rfid_tag', type: 'text', nullable: true })
  rfidTag: string | null;

  @Column({ type: 'text', nullable: true })
  location: string | null;

  @Column({ name: 'replacement_value_minor', type: 'bigint', nullable: true, transformer: bigintAsNumber })
  replacementValueMinor: number | null;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @Column({ type: 'text', default: 'ready' })
  status: AssetStatus;

  /** Type-specific facts, validated per type by shared/schemas/assets.ts. */
  @Column({ type: 'jsonb' })
  specs: Record<string, unknown> = {};

  /** Check tolerances for this item, replacing the firm's defaults (by check kind). */
  @Column({ name: 'tolerance_overrides', type: 'jsonb', nullable: true })
  toleranceOverrides: Partial<Record<CheckKind, Tolerance>> | null;

  @Index()
  @Column({ name: 'kit_id', type: 'uuid', nullable: true })
  kitId: string | null;

  @ManyToOne(() => Kit, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'kit_id' })
  kit?: Kit | null;

  @Column({ name: 'calibration_required', type: 'boolean', default: false })
  calibrationRequired: boolean;

  @Column({ name: 'calibration_interval_months', type: 'integer', nullable: true })
  calibrationIntervalMonths: number | null;

  @Column({ name: 'calibration_provider', type: 'text', nullable: true })
  calibrationProvider: string | null;

  @Column({ name: 'last_calibrated_on', type: 'date', nullable: true })
  lastCalibratedOn: string | null;

  /** Kept with the plan (and later set by calibration events) so lists can filter and sort by it. */
  // The calibration review's partial index on (organization, due date with undated first, tag); made by CalibrationDueIndex.
  @Index('assets_calibration_due', { synchronize: false })
  @Column({ name: 'due_on', type: 'date', nullable: true })
  dueOn: string | null;

  /** The calibration state last reported by the daily scan, so each change is mailed once. */
  @Column({ name: 'notified_calibration_state', type: 'text', nullable: true })
  notifiedCalibrationState: string | null;

  /** Lower-cased tag, serial, RFID, maker, model and location, kept by a database
   * trigger and trigram-indexed for the fleet search (see FleetSearchColumn). */
  @Index('assets_search_text_trgm', { synchronize: false }) // a GIN trigram index TypeORM cannot describe; made by the migration
  @Column({ name: 'search_text', type: 'text', default: '', select: false, insert: false, update: false })
  searchText?: string;

  /** Tag, serial and RFID in their forgiving form (shared/assets/search-key.ts), kept by the same trigger. */
  @Index('assets_search_key_trgm', { synchronize: false }) // GIN trigram, made by the FleetForgivingSearch migration
  @Column({ name: 'search_key', type: 'text', default: '', select: false, insert: false, update: false })
  searchKey?: string;

  @Column({ name: 'retired_at', type: 'timestamptz', nullable: true })
  retiredAt: Date | null;

  @Column({ name: 'retired_reason', type: 'text', nullable: true })
  retiredReason: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
