import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Decision, DecisionRule } from '../../shared/checks/decision';
import type { CheckKind } from '../../shared/schemas/checks';
import { AssetBound, type AssetRecord } from '../fleet';

/** A measurement taken in the field to confirm an item still performs (DESIGN.md §3):
 * its inputs, the computed results and the decision, as recorded. */
@Entity({ name: 'field_checks' })
@Index(['organizationId', 'assetId', 'kind', 'performedAt'])
export class FieldCheck extends AssetBound {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  kind: CheckKind;

  /** The item the check is about: the tip, or the tracker. */
  /** Tip validation: the probe the tip was on. Length check: the scale bar. */
  @Column({ name: 'related_asset_id', type: 'uuid', nullable: true })
  relatedAssetId: string | null;

  @ManyToOne('Asset', { onDelete: 'RESTRICT', nullable: true })
  @JoinColumn({ name: 'related_asset_id' })
  relatedAsset?: AssetRecord | null;

  /** Tip mounting position (tip validations only). */
  @Column({ type: 'text', nullable: true })
  position: string | null;

  @Column({ type: 'jsonb' })
  inputs: Record<string, unknown>;

  @Column({ type: 'jsonb' })
  result: Record<string, unknown>;

  @Column({ name: 'tolerance_um', type: 'double precision' })
  toleranceUm: number;

  @Column({ name: 'expanded_uncertainty_um', type: 'double precision' })
  expandedUncertaintyUm: number;

  @Column({ name: 'guard_band_um', type: 'double precision' })
  guardBandUm: number;

  @Column({ name: 'decision_rule', type: 'text' })
  decisionRule: DecisionRule;

  @Column({ type: 'text' })
  decision: Decision;

  @Column({ name: 'performed_at', type: 'timestamptz' })
  performedAt: Date;

  @Column({ name: 'performed_by', type: 'uuid' })
  performedBy: string;

  @Column({ type: 'text', nullable: true })
  note: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
