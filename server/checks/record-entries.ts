import type { Decision, DecisionRule } from '../../shared/checks/decision';
import type { CheckKind } from '../../shared/schemas/checks';
import type { RecordPeriod } from '../../shared/records/views';
import type { Scoped } from '../db/scoped';

export type CheckEntry = {
  id: string;
  assetId: string;
  kind: CheckKind;
  performedAt: Date;
  performedById: string;
  position: string | null;
  relatedAssetTag: string | null;
  inputs: Record<string, unknown>;
  result: Record<string, unknown>;
  toleranceUm: number;
  expandedUncertaintyUm: number;
  guardBandUm: number;
  decisionRule: DecisionRule;
  decision: Decision;
  note: string | null;
};

/** The items' field checks performed in the period (the firm's calendar days), oldest first. */
export function checksForRecord(tx: Scoped, assetIds: string[], period: RecordPeriod, timeZone: string): Promise<CheckEntry[]> {
  return tx.sql<CheckEntry>(
    `SELECT c.id, c.asset_id AS "assetId", c.kind, c.performed_at AS "performedAt", c.performed_by AS "performedById", c.position,
            r.asset_tag AS "relatedAssetTag", c.inputs, c.result, c.tolerance_um AS "toleranceUm", c.expanded_uncertainty_um AS "expandedUncertaintyUm",
            c.guard_band_um AS "guardBandUm", c.decision_rule AS "decisionRule", c.decision, c.note
       FROM field_checks c LEFT JOIN assets r ON r.id = c.related_asset_id
      WHERE c.organization_id = $1 AND c.asset_id = ANY($2::uuid[])
        AND ($3::date IS NULL OR (c.performed_at AT TIME ZONE $5)::date >= $3::date)
        AND ($4::date IS NULL OR (c.performed_at AT TIME ZONE $5)::date <= $4::date)
      ORDER BY c.asset_id, c.performed_at, c.id`,
    [assetIds, period.from, period.to, timeZone],
  );
}

/** Items with a failing field check in the period. */
export async function failedCheckAssetIds(tx: Scoped, period: RecordPeriod, timeZone: string): Promise<string[]> {
  const rows = await tx.sql<{ id: string }>(
    `SELECT DISTINCT asset_id AS id FROM field_checks WHERE organization_id = $1 AND decision = 'fail'
        AND ($2::date IS NULL OR (performed_at AT TIME ZONE $4)::date >= $2::date) AND ($3::date IS NULL OR (performed_at AT TIME ZONE $4)::date <= $3::date)`,
    [period.from, period.to, timeZone],
  );
  return rows.map((r) => r.id);
}
