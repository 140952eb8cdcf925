import 'reflect-metadata';
import pg from 'pg';
import { BENCH_EMAIL } from './seed-bench-fleet';

/**
 * Benchmark bookings for the benchmark firm: ten bookings per asset spread
 * over the past two years and the coming year (200,000 for 20,000 assets),
 * plus one 20-item kit that is free and valid for the coming months.
 * Set-based SQL: a few statements, not a query per row.
 */
const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
await client.connect();
const [{ organization_id: org, id: userId }] = (await client.query(`SELECT organization_id, id FROM users WHERE email = $1`, [BENCH_EMAIL])).rows;
const already = (await client.query(`SELECT count(*)::int AS n FROM bookings WHERE organization_id = $1`, [org])).rows[0].n;
if (already === 0) {
  await client.query('BEGIN');
  await client.query(`
    CREATE TEMP TABLE plan ON COMMIT DROP AS
    SELECT gen_random_uuid() AS booking_id, a.id AS asset_id,
           current_date - 700 + g.k * 100 + (a.rn % 30)::int AS starts_on,
           current_date - 700 + g.k * 100 + (a.rn % 30)::int + 4 + ((a.rn + g.k) % 20)::int AS ends_on
      FROM (SELECT id, row_number() OVER (ORDER BY asset_tag) AS rn FROM assets WHERE organization_id = $1) a
      CROSS JOIN generate_series(0, 9) AS g(k)`, [org]);
  await client.query(`
    INSERT INTO bookings (id, organization_id, starts_on, ends_on, state, purpose, created_by, created_at, updated_at)
    SELECT booking_id, $1, starts_on, ends_on, CASE WHEN ends_on < current_date THEN 'returned' ELSE 'reserved' END, 'internal', $2, now(), now() FROM plan`, [org, userId]);
  await client.query(`
    INSERT INTO booking_items (organization_id, booking_id, asset_id, starts_on, ends_on, active)
    SELECT $1, booking_id, asset_id, starts_on, ends_on, ends_on >= current_date FROM plan`, [org]);
  // A 20-item kit of items that need no calibration. Every asset's bookings leave days 54–99 from today free.
  const kit = (await client.query(`INSERT INTO kits (organization_id, name, created_at, updated_at) VALUES ($1, 'Bench kit of twenty', now(), now()) RETURNING id`, [org])).rows[0].id;
  await client.query(`
    UPDATE assets SET kit_id = $2 WHERE id IN (
      SELECT a.id FROM assets a WHERE a.organization_id = $1 AND a.status = 'ready' AND NOT a.calibration_required AND a.type <> 'tip'
        AND NOT EXISTS (SELECT 1 FROM booking_items bi WHERE bi.asset_id = a.id AND bi.active
                         AND daterange(bi.starts_on, bi.ends_on, '[]') && daterange(current_date + 54, current_date + 99, '[]'))
      ORDER BY a.asset_tag LIMIT 20)`, [org, kit]);
  await client.query('COMMIT');
  const [{ n }] = (await client.query(`SELECT count(*)::int AS n FROM bookings WHERE organization_id = $1`, [org])).rows;
  console.log(`Seeded ${n} benchmark bookings (ten per asset) and a 20-item kit.`);
}
await client.end();
