import type { HoldReason, HoldReleaseEvidence } from '../../shared/holds/views';
import type { RecordPeriod } from '../../shared/records/views';
import type { Scoped } from '../db/scoped';

export type HoldEntry = {
  id: string;
  assetId: string;
  reason: HoldReason;
  summary: string;
  startedAt: Date;
  startedById: string;
  releasedAt: Date | null;
  releasedById: string | null;
  releaseEvidence: HoldReleaseEvidence | null;
};

/** The items' holds that were in force at any time in the period, oldest first. */
export function holdsForRecord(tx: Scoped, assetIds: string[], period: RecordPeriod, timeZone: string): Promise<HoldEntry[]> {
  return tx.sql<HoldEntry>(
    `SELECT h.id, h.asset_id AS "assetId", h.reason, h.summary, h.started_at AS "startedAt", h.started_by AS "startedById",
            h.released_at AS "releasedAt", h.released_by AS "releasedById", h.release_evidence AS "releaseEvidence"
       FROM holds h
      WHERE h.organization_id = $1 AND h.asset_id = ANY($2::uuid[])
        AND ($4::date IS NULL OR (h.started_at AT TIME ZONE $5)::date <= $4::date)
        AND ($3::date IS NULL OR h.released_at IS NULL OR (h.released_at AT TIME ZONE $5)::date >= $3::date)
      ORDER BY h.asset_id, h.started_at, h.id`,
    [assetIds, period.from, period.to, timeZone],
  );
}

/** Items on hold at any time in the period. */
export async function heldAssetIds(tx: Scoped, period: RecordPeriod, timeZone: string): Promise<string[]> {
  const rows = await tx.sql<{ id: string }>(
    `SELECT DISTINCT asset_id AS id FROM holds WHERE organization_id = $1
        AND ($3::date IS NULL OR (started_at AT TIME ZONE $4)::date <= $3::date)
        AND ($2::date IS NULL OR released_at IS NULL OR (released_at AT TIME ZONE $4)::date >= $2::date)`,
    [period.from, period.to, timeZone],
  );
  return rows.map((r) => r.id);
}
