import 'reflect-metadata';
import { dueScanRoutine } from '../../server/calibration/due-scan.routine';
import { openDataSource } from '../../server/data-source';
import { benchScale, percentile } from './load';

/**
 * Calibration measurements against the benchmark firm (scripts/bench.mjs calibration; BENCH_ASSETS sets the size): the
 * daily due scan, run directly (every firm, as "run now" does), and the review page's API, CSV and PDF under
 * sequential requests, as the owner opens them.
 */
const base = process.env.BENCH_URL!;
const scale = await benchScale();
console.log(`\nBenchmark firm: ${scale}`);

const db = await openDataSource(process.env.DATABASE_URL!, 4).initialize();
// The scan marks each change once; reset the marks so every run does the full work of a first scan.
await db.query(`UPDATE assets SET notified_calibration_state = NULL WHERE notified_calibration_state IS NOT NULL`);
await db.query('VACUUM ANALYZE assets');
const t0 = performance.now();
const summary = await dueScanRoutine().run({ db, now: new Date(), trigger: 'manual', organizationId: null });
const scanMs = performance.now() - t0;
console.log(`Daily due scan (first scan, every item newly marked): ${(scanMs / 1000).toFixed(2)} s (${JSON.stringify(summary)})`);
const t1 = performance.now();
const again = await dueScanRoutine().run({ db, now: new Date(), trigger: 'manual', organizationId: null });
console.log(`Daily due scan (next day's run, nothing new): ${((performance.now() - t1) / 1000).toFixed(2)} s (${JSON.stringify(again)})`);
// The review is read later in the day, after autovacuum has followed the scan (assets: 1 % threshold); wait for it
// as a firm would, and say how long it took.
const scanned = new Date();
const waitStart = performance.now();
for (;;) {
  const [{ last }] = await db.query(`SELECT greatest(last_autovacuum, last_vacuum) AS last FROM pg_stat_user_tables WHERE relname = 'assets'`);
  if (last && new Date(last) >= scanned) break;
  if (performance.now() - waitStart > 300_000) {
    console.log('Autovacuum did not follow the scan within 5 minutes: the review below reads the table as well.');
    break;
  }
  await new Promise((resolve) => setTimeout(resolve, 2000));
}
console.log(`Autovacuum followed the scan after ${((performance.now() - waitStart) / 1000).toFixed(0)} s.`);
await db.destroy();

const login = await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ email: 'bench@bench.test', password: 'nestkeeper-demo' }),
});
const { token } = (await login.json()) as { token: string };

async function sequential(path: string, count: number) {
  const times: number[] = [];
  for (let i = 0; i < count; i += 1) {
    const start = performance.now();
    const res = await fetch(`${base}${path}`, { headers: { authorization: `Bearer ${token}` } });
    await res.arrayBuffer();
    if (res.status !== 200) throw new Error(`${path} answered ${res.status}`);
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  console.log(
    `GET ${path.padEnd(26)} ${count} sequential requests: p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms, max ${times[count - 1].toFixed(1)} ms`,
  );
}
// Warm-up first (plans, caches, the server's own JIT), printed too so nothing is hidden.
await sequential('/api/calibration/review', 5);
await sequential('/api/calibration/review', 40);
await sequential('/api/calibration/review.csv', 10);
await sequential('/api/calibration/review.pdf', 10);
