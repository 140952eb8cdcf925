import 'reflect-metadata';
import pg from 'pg';
import { countBookings, seedBenchBookings } from '../bookings';
import { BENCH_EMAIL } from './seed-bench-fleet';

/**
 * Benchmark bookings for the benchmark firm: BENCH_BOOKINGS_PER_ASSET (default ten) bookings per asset spread over
 * the past two years and the coming year (200,000 for 20,000 assets), plus one 20-item kit that is free and valid
 * for the coming months. Set-based SQL: a few statements, not a query per row.
 */
const perAsset = Number(process.env.BENCH_BOOKINGS_PER_ASSET ?? 10);
if (!Number.isInteger(perAsset) || perAsset < 1 || perAsset > 50) throw new Error('BENCH_BOOKINGS_PER_ASSET must be a whole number from 1 to 50.');
const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
await client.connect();
const [{ organization_id: org, id: userId }] = (await client.query(`SELECT organization_id, id FROM users WHERE email = $1`, [BENCH_EMAIL])).rows;
if ((await countBookings(client, org)) === 0) {
  await client.query('BEGIN');
  await seedBenchBookings(client, org, userId, perAsset);
  // A 20-item kit of items that need no calibration. Every asset's bookings leave days 54–99 from today free.
  const kit = (
    await client.query(`INSERT INTO kits (organization_id, name, created_at, updated_at) VALUES ($1, 'Bench kit of twenty', now(), now()) RETURNING id`, [org])
  ).rows[0].id;
  await client.query(
    `
    UPDATE assets SET kit_id = $2 WHERE id IN (
      SELECT a.id FROM assets a WHERE a.organization_id = $1 AND a.status = 'ready' AND NOT a.calibration_required AND a.type <> 'tip'
        AND NOT EXISTS (SELECT 1 FROM booking_items bi WHERE bi.asset_id = a.id AND bi.active
                         AND daterange(bi.starts_on, bi.ends_on, '[]') && daterange(current_date + 54, current_date + 99, '[]'))
      ORDER BY a.asset_tag LIMIT 20)`,
    [org, kit],
  );
  await client.query('COMMIT');
  console.log(`Seeded ${await countBookings(client, org)} benchmark bookings (${perAsset} per asset) and a 20-item kit.`);
}
await client.end();
