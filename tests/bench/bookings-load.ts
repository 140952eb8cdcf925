import { backToBack, benchScale, describeLoad, oneAtATime, peoplePaced, percentile } from './load';
import { addDays, todayIn } from '../../shared/calibration/due-date';

/**
 * Booking measurements against a server with the benchmark firm and its
 * bookings (scripts/bench.mjs bookings): availability for one type over a
 * two-week window under 20 concurrent clients, and creating 20-item kit bookings.
 */
const base = process.env.BENCH_URL!;
const login = await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ email: 'bench@bench.test', password: 'nestkeeper-demo' }),
});
const { token } = (await login.json()) as { token: string };
const headers = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };
const today = todayIn('Europe/Berlin');
const scale = await benchScale();
console.log(`\nBenchmark firm: ${scale}`);

const availability = `${base}/api/availability?type=smr&startsOn=${addDays(today, 40)}&endsOn=${addDays(today, 53)}&limit=100`;
const first = (await (await fetch(availability, { headers })).json()) as { items: unknown[] };
console.log(`\nGET /api/availability (type smr, two weeks, up to 100 free SMRs; this window has ${first.items.length}):`);
console.log(`  one at a time                                  ${describeLoad(await oneAtATime(availability, headers))}`);
console.log(`  20 people, think time ~200 ms (exponential)    ${describeLoad(await peoplePaced(availability, headers))}`);
console.log(`  20 connections back to back (saturation)       ${describeLoad(await backToBack(availability, headers))}`);

const kits = (await (await fetch(`${base}/api/kits?limit=500`, { headers })).json()) as { items: { id: string; name: string; memberCount: number }[] };
const kit = kits.items.find((k) => k.name === 'Bench kit of twenty')!;
const create: number[] = [];
for (let i = 0; i < 20; i += 1) {
  const startsOn = addDays(today, 60 + i * 2);
  const t0 = performance.now();
  const res = await fetch(`${base}/api/bookings`, { method: 'POST', headers, body: JSON.stringify({ kitId: kit.id, startsOn, endsOn: addDays(startsOn, 1) }) });
  create.push(performance.now() - t0);
  if (res.status !== 201) throw new Error(`booking ${i} answered ${res.status}: ${await res.text()}`);
}
create.sort((a, b) => a - b);
console.log(
  `POST /api/bookings of a ${kit.memberCount}-item kit, 20 in a row: p50 ${percentile(create, 50).toFixed(1)} ms, p95 ${percentile(create, 95).toFixed(1)} ms, max ${create[create.length - 1].toFixed(1)} ms`,
);

const review: number[] = [];
for (let i = 0; i < 20; i += 1) {
  const t0 = performance.now();
  await (await fetch(`${base}/api/calibration/review`, { headers })).arrayBuffer();
  review.push(performance.now() - t0);
}
review.sort((a, b) => a - b);
console.log(
  `GET /api/calibration/review at ${scale}, 20 sequential requests: p50 ${percentile(review, 50).toFixed(1)} ms, p95 ${percentile(review, 95).toFixed(1)} ms`,
);
