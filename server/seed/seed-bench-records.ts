import 'reflect-metadata';
import pg from 'pg';
import { MM, renderPdf } from '../documents/pdf';
import { BENCH_EMAIL } from './seed-bench-fleet';

/**
 * What an audit pack of the benchmark firm reads besides its 20,000 items: one certificate (a small generated
 * PDF, stored per event as uploads are) behind each calibration of the past year, one in fifty found out of
 * tolerance, and a hold behind each item on hold. Set-based SQL: a few statements, not a query per row.
 */
const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
await client.connect();
const [{ organization_id: org, id: userId }] = (await client.query(`SELECT organization_id, id FROM users WHERE email = $1`, [BENCH_EMAIL])).rows;
const [{ n }] = (await client.query(`SELECT count(*)::int AS n FROM calibration_events WHERE organization_id = $1`, [org])).rows;
if (n === 0) {
  const certificate = await renderPdf({ size: 'A4', margin: 20 * MM }, (doc) =>
    doc.font('Helvetica-Bold').fontSize(14).text('Fenmoor Calibration Lab').font('Helvetica').fontSize(10).text('Calibration certificate — BENCHMARK DOCUMENT'),
  );
  await client.query('BEGIN');
  await client.query(
    `WITH covered AS (
       SELECT a.id, a.asset_tag, a.last_calibrated_on, a.due_on, row_number() OVER (ORDER BY a.asset_tag) AS i
         FROM assets a WHERE a.organization_id = $1 AND a.calibration_required AND a.last_calibrated_on >= current_date - 365),
     files AS (
       INSERT INTO certificate_files (organization_id, file_name, size_bytes, data)
       SELECT $1, 'FCL-' || asset_tag || '.pdf', length($2::bytea), $2::bytea FROM covered RETURNING id, file_name)
     INSERT INTO calibration_events (organization_id, asset_id, performed_on, provider, certificate_number, certificate_file_id, as_found, as_left,
                                     interval_months, due_on, suggested_interval_months, suggestion_reason, suggested_change, recorded_by)
     SELECT $1, c.id, c.last_calibrated_on, 'Fenmoor Calibration Lab', 'FCL-' || c.asset_tag, f.id,
            CASE WHEN c.i % 50 = 0 THEN 'out_of_tolerance' ELSE 'in_tolerance' END, 'in_tolerance', 12, c.due_on, 12, 'Benchmark data', 'keep', $3
       FROM covered c JOIN files f ON f.file_name = 'FCL-' || c.asset_tag || '.pdf'`,
    [org, certificate, userId],
  );
  await client.query(
    `INSERT INTO holds (organization_id, asset_id, reason, summary, started_at, started_by)
     SELECT $1, id, 'manual', 'Benchmark hold', now() - interval '30 days', $2 FROM assets WHERE organization_id = $1 AND status = 'held'`,
    [org, userId],
  );
  await client.query('COMMIT');
  const [{ events }] = (await client.query(`SELECT count(*)::int AS events FROM calibration_events WHERE organization_id = $1`, [org])).rows;
  console.log(`Seeded ${events} benchmark calibrations with certificates, and the holds of the held items.`);
}
await client.end();
