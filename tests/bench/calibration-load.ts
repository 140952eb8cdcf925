import 'reflect-metadata';
import { dueScanRoutine } from '../../server/calibration/due-scan.routine';
import { openDataSource } from '../../server/data-source';

/**
 * Calibration measurements against the benchmark firm (scripts/bench.mjs
 * calibration: 100,000 assets, 1,000,000 bookings): the daily due scan, run
 * directly, and the review page's API under sequential requests.
 */
const base = process.env.BENCH_URL!;
const db = await openDataSource(process.env.DATABASE_URL!, 4).initialize();
const [{ assets }] = await db.query(`SELECT count(*)::int AS assets FROM assets`);
const [{ bookings }] = await db.query(`SELECT count(*)::int AS bookings FROM bookings`);
const t0 = performance.now();
const summary = await dueScanRoutine().run({ db, now: new Date(), trigger: 'manual', organizationId: null });
const scanMs = performance.now() - t0;
console.log(`\nDaily due scan over ${assets} assets and ${bookings} bookings: ${(scanMs / 1000).toFixed(2)} s (${JSON.stringify(summary)})`);
await db.destroy();

const login = await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ email: 'bench@bench.test', password: 'nestkeeper-demo' }),
});
const { token } = (await login.json()) as { token: string };
const times: number[] = [];
for (let i = 0; i < 20; i += 1) {
  const start = performance.now();
  const res = await fetch(`${base}/api/calibration/review`, { headers: { authorization: `Bearer ${token}` } });
  await res.arrayBuffer();
  times.push(performance.now() - start);
}
times.sort((a, b) => a - b);
console.log(
  `GET /api/calibration/review at ${assets - 95} benchmark assets, 20 sequential requests: median ${times[10].toFixed(1)} ms, max ${times[19].toFixed(1)} ms`,
);
