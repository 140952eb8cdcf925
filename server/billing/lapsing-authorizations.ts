import type { DataSource } from 'typeorm';

/** Windows ahead in which the operator's metrics count card authorizations that will lapse (the renewal routine should take them first). */
export const LAPSE_WINDOWS_HOURS = [24, 72];

/** Open card authorizations across every firm that lapse within each window from now. */
export async function lapsingAuthorizations(db: DataSource): Promise<{ withinHours: number; count: number }[]> {
  const rows: { within: number; count: string }[] = await db.query(
    `SELECT w AS within, count(d.id) AS count
       FROM unnest($1::int[]) AS w
       LEFT JOIN deposit_authorizations d
         ON d.state = 'authorized' AND d.capture_before IS NOT NULL AND d.capture_before <= now() + make_interval(hours => w)
      GROUP BY w ORDER BY w`,
    [LAPSE_WINDOWS_HOURS],
  );
  return rows.map((r) => ({ withinHours: r.within, count: Number(r.count) }));
}
