import type pg from 'pg';

/** Bookings of a firm, any state (the benchmark seed runs once per database). */
export async function countBookings(client: pg.ClientBase, organizationId: string): Promise<number> {
  return (await client.query(`SELECT count(*)::int AS n FROM bookings WHERE organization_id = $1`, [organizationId])).rows[0].n;
}

/**
 * `perAsset` bookings per asset of the firm, one every hundred days from two years ago (ten reach a year ahead);
 * past ones returned, the rest reserved. Every asset's bookings leave days 54–99 from today free.
 * Set-based SQL inside the caller's transaction: a few statements, not a query per row.
 */
export async function seedBenchBookings(client: pg.ClientBase, organizationId: string, createdBy: string, perAsset = 10) {
  await client.query(
    `
    CREATE TEMP TABLE plan ON COMMIT DROP AS
    SELECT gen_random_uuid() AS booking_id, a.id AS asset_id,
           current_date - 700 + g.k * 100 + (a.rn % 30)::int AS starts_on,
           current_date - 700 + g.k * 100 + (a.rn % 30)::int + 4 + ((a.rn + g.k) % 20)::int AS ends_on
      FROM (SELECT id, row_number() OVER (ORDER BY asset_tag) AS rn FROM assets WHERE organization_id = $1) a
      CROSS JOIN generate_series(0, $2::int - 1) AS g(k)`,
    [organizationId, perAsset],
  );
  await client.query(
    `
    INSERT INTO bookings (id, organization_id, starts_on, ends_on, state, purpose, created_by, created_at, updated_at)
    SELECT booking_id, $1, starts_on, ends_on, CASE WHEN ends_on < current_date THEN 'returned' ELSE 'reserved' END, 'internal', $2, now(), now() FROM plan`,
    [organizationId, createdBy],
  );
  await client.query(
    `
    INSERT INTO booking_items (organization_id, booking_id, asset_id, starts_on, ends_on, active)
    SELECT $1, booking_id, asset_id, starts_on, ends_on, ends_on >= current_date FROM plan`,
    [organizationId],
  );
}
