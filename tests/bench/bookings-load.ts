import autocannon from 'autocannon';
import { addDays, todayIn } from '../../shared/calibration/due-date';

/**
 * Booking measurements against a server with the benchmark firm and its
 * bookings (scripts/bench.mjs bookings): availability for one type over a
 * two-week window under 20 concurrent clients, and creating 20-item kit bookings.
 */
const base = process.env.BENCH_URL!;
const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench@bench.test', password: 'nestkeeper-demo' }) });
const { token } = (await login.json()) as { token: string };
const headers = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };
const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
const today = todayIn('Europe/Berlin');

/** 20 clients back to back, or each paced at `ratePerClient` requests a second. */
async function availability(label: string, ratePerClient?: number) {
  const times: number[] = [];
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon(
      {
        url: `${base}/api/availability?type=smr&startsOn=${addDays(today, 40)}&endsOn=${addDays(today, 53)}&limit=100`,
        connections: 20,
        duration: 15,
        headers,
        ...(ratePerClient ? { connectionRate: ratePerClient } : {}),
      },
      (err, r) => (err ? reject(err) : resolve(r)),
    );
    instance.on('response', (_c, _s, _b, ms) => times.push(ms));
  });
  times.sort((a, b) => a - b);
  console.log(`GET /api/availability (type smr, two weeks), 20 connections ${label}, 15 s: ${result.requests.total} requests, ${result.requests.average.toFixed(0)} req/s, p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms, p99 ${percentile(times, 99).toFixed(1)} ms`);
}
console.log('');
await availability('back to back');
await availability('each paced at 5 requests a second', 5);

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
console.log(`POST /api/bookings of a ${kit.memberCount}-item kit, 20 in a row: p50 ${percentile(create, 50).toFixed(1)} ms, p95 ${percentile(create, 95).toFixed(1)} ms, max ${create[create.length - 1].toFixed(1)} ms`);

const review: number[] = [];
for (let i = 0; i < 20; i += 1) {
  const t0 = performance.now();
  await (await fetch(`${base}/api/calibration/review`, { headers })).arrayBuffer();
  review.push(performance.now() - t0);
}
review.sort((a, b) => a - b);
console.log(`GET /api/calibration/review at 20,000 assets, 20 sequential requests: p50 ${percentile(review, 50).toFixed(1)} ms, p95 ${percentile(review, 95).toFixed(1)} ms`);
