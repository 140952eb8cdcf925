import { percentile } from './load';

/**
 * "Forgot password" must not tell by its timing whether an address has an account. The route answers before
 * it looks the address up (tests/api/accounts.test.ts proves that order with the users table locked); this
 * prints the answer times for a known and an unknown address, interleaved, so a person can compare them.
 * Printed only, never asserted.
 */
const base = process.env.BENCH_URL!;
const ROUNDS = 200;

async function timed(email: string) {
  const started = performance.now();
  const res = await fetch(`${base}/api/auth/password-reset`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email }),
  });
  await res.text();
  if (res.status !== 202) throw new Error(`password reset answered ${res.status}`);
  return performance.now() - started;
}

const known: number[] = [];
const unknown: number[] = [];
for (let i = 0; i < ROUNDS; i += 1) {
  known.push(await timed('bench@bench.test'));
  unknown.push(await timed(`nobody-${i}@bench.test`));
}
const describe = (ms: number[]) => {
  const sorted = [...ms].sort((a, b) => a - b);
  return `p50 ${percentile(sorted, 50).toFixed(1)} ms, p95 ${percentile(sorted, 95).toFixed(1)} ms, max ${sorted[sorted.length - 1].toFixed(1)} ms`;
};
console.log(`\nPOST /api/auth/password-reset, ${ROUNDS} each, one at a time, interleaved`);
console.log(`${'address with an account'.padEnd(28)} ${describe(known)}`);
console.log(`${'address without one'.padEnd(28)} ${describe(unknown)}`);
