import { addDays } from '../../shared/calibration/due-date';
import { failsBy, forecastDrift, type DriftPoint } from '../../shared/checks/drift-forecast';
import type { TipForecastView } from '../../shared/checks/views';
import type { TipPosition } from '../../shared/assets/vocabulary';
import type { Scoped } from '../db/scoped';
import type { OrgContext } from '../organizations';

type Row = { assetId: string; assetTag: string; position: TipPosition; performedAt: Date; maxDeviationUm: number; limitUm: number; decision: 'pass' | 'fail' };

/**
 * Drift forecasts of the firm's tips in service (or of the given tips), per
 * mounting position: the passing validations since the position's last
 * failure, against the latest one's acceptance limit (tolerance less guard band).
 */
export async function tipForecasts(tx: Scoped, ctx: OrgContext, assetIds?: string[], now = new Date()): Promise<TipForecastView[]> {
  const rows = await tx.sql<Row>(
    `SELECT fc.asset_id AS "assetId", a.asset_tag AS "assetTag", fc.position, fc.performed_at AS "performedAt",
            (fc.result->>'maxDeviationUm')::float8 AS "maxDeviationUm", fc.tolerance_um - fc.guard_band_um AS "limitUm", fc.decision
       FROM field_checks fc JOIN assets a ON a.id = fc.asset_id
      WHERE fc.organization_id = $1 AND fc.kind = 'tip_validation' AND a.status <> 'retired' AND ($2::uuid[] IS NULL OR fc.asset_id = ANY($2))
      ORDER BY a.asset_tag, fc.position, fc.performed_at, fc.created_at`,
    [assetIds ?? null],
  );
  const series = new Map<string, Row[]>();
  for (const r of rows) {
    const key = `${r.assetId}:${r.position}`;
    // A failure starts the history afresh: the tip was recalibrated or replaced since.
    series.set(key, r.decision === 'fail' ? [] : [...(series.get(key) ?? []), r]);
  }
  const until = addDays(ctx.today, ctx.dueSoonDays);
  const latest = new Map(rows.map((r) => [`${r.assetId}:${r.position}`, r]));
  return [...latest.entries()].map(([key, last]) => {
    const passes = series.get(key) ?? [];
    const points: DriftPoint[] = passes.map((p) => ({ performedAt: p.performedAt.toISOString(), maxDeviationUm: p.maxDeviationUm }));
    const forecast = forecastDrift(points, passes.at(-1)?.limitUm ?? 0, now, ctx.timeZone);
    return { assetId: last.assetId, assetTag: last.assetTag, position: last.position, forecast, failsSoon: failsBy(forecast, until) };
  });
}
