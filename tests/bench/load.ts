import autocannon from 'autocannon';
import pg from 'pg';

export const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];

export type LoadResult = { requests: number; perSecond: number; p50: number; p95: number; p99: number; failed: number };

export const describeLoad = (r: LoadResult) =>
  `${String(r.requests).padStart(6)} req  ${r.perSecond.toFixed(0).padStart(5)} req/s  p50 ${r.p50.toFixed(1)} ms  p95 ${r.p95.toFixed(1)} ms  p99 ${r.p99.toFixed(1)} ms${r.failed ? `  (${r.failed} not 2xx!)` : ''}`;

const summarise = (times: number[], seconds: number, failed: number): LoadResult => {
  times.sort((a, b) => a - b);
  return {
    requests: times.length,
    perSecond: times.length / seconds,
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    p99: percentile(times, 99),
    failed,
  };
};

/** 20 connections firing back to back for `seconds`: the saturation point of the machine (autocannon). */
export async function backToBack(url: string, headers: Record<string, string>, seconds = 15): Promise<LoadResult> {
  const times: number[] = [];
  let failed = 0;
  await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon({ url, connections: 20, duration: seconds, headers }, (err, r) => (err ? reject(err) : resolve(r)));
    instance.on('response', (_client, status, _bytes, ms) => {
      times.push(ms);
      if (status >= 300) failed += 1;
    });
  });
  return summarise(times, seconds, failed);
}

/**
 * `clients` people each waiting a random think time (exponential, mean
 * `meanThinkMs`) before their next request, so arrivals spread out as they do
 * when people click — unlike a fixed rate, which releases every client at
 * the same tick.
 */
export async function peoplePaced(
  url: string,
  headers: Record<string, string>,
  opts: { clients?: number; meanThinkMs?: number; seconds?: number } = {},
): Promise<LoadResult> {
  const { clients = 20, meanThinkMs = 200, seconds = 15 } = opts;
  const until = performance.now() + seconds * 1000;
  const times: number[] = [];
  let failed = 0;
  const person = async () => {
    while (performance.now() < until) {
      await new Promise((r) => setTimeout(r, -Math.log(1 - Math.random()) * meanThinkMs));
      const t0 = performance.now();
      const res = await fetch(url, { headers });
      await res.arrayBuffer();
      times.push(performance.now() - t0);
      if (res.status >= 300) failed += 1;
    }
  };
  await Promise.all(Array.from({ length: clients }, person));
  return summarise(times, seconds, failed);
}

/** One client, one request at a time: the cost of a request with the machine otherwise quiet. */
export async function oneAtATime(url: string, headers: Record<string, string>, count = 200): Promise<LoadResult> {
  const times: number[] = [];
  let failed = 0;
  const t = performance.now();
  for (let i = 0; i < count; i += 1) {
    const t0 = performance.now();
    const res = await fetch(url, { headers });
    await res.arrayBuffer();
    times.push(performance.now() - t0);
    if (res.status >= 300) failed += 1;
  }
  return summarise(times, (performance.now() - t) / 1000, failed);
}

/** The benchmark firm's real size, for the printouts ("100,000 assets, 1,000,000 bookings"): counted, never assumed. */
export async function benchScale(): Promise<string> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    const [{ assets, bookings }] = (
      await client.query(
        `SELECT (SELECT count(*) FROM assets a WHERE a.organization_id = u.organization_id)::int AS assets,
                (SELECT count(*) FROM bookings b WHERE b.organization_id = u.organization_id)::int AS bookings
           FROM users u WHERE u.email = 'bench@bench.test'`,
      )
    ).rows;
    const n = new Intl.NumberFormat('en-GB');
    return `${n.format(assets)} assets, ${n.format(bookings)} bookings`;
  } finally {
    await client.end();
  }
}
