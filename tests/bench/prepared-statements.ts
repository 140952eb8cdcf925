import pg from 'pg';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { SESSION_CHECK } from '../../server/auth/passport';
import { AVAILABLE_ASSETS } from '../../server/bookings/booking-queries';
import { secondStepRoles } from '../../shared/auth/roles';
import { percentile } from './load';

/**
 * What the named prepared statements save on the two hot paths (the per-request sign-in check and availability):
 * each statement run back to back on one connection, named (parsed once, then bound and executed) and unnamed
 * (parsed, planned and executed every time), in alternating rounds; then how PostgreSQL planned the named runs
 * (pg_prepared_statements: generic or custom plan each time) and the same with plan_cache_mode forcing a generic plan.
 */
const base = process.env.BENCH_URL!;
await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ email: 'bench@bench.test', password: 'nestkeeper-demo' }),
});
const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
await client.connect();
const [session] = (
  await client.query(
    `SELECT s.id, s.user_id, u.organization_id FROM user_sessions s JOIN users u ON u.id = s.user_id WHERE u.email = 'bench@bench.test' ORDER BY s.created_at DESC LIMIT 1`,
  )
).rows;
const today = todayIn('Europe/Berlin');
const statements = [
  { name: 'sign-in check', text: SESSION_CHECK, values: [session.user_id, session.organization_id, session.id, secondStepRoles] },
  { name: 'availability', text: AVAILABLE_ASSETS, values: [session.organization_id, 'smr', addDays(today, 40), addDays(today, 53), [], 100] },
];

async function timed(run: () => Promise<unknown>, count: number) {
  const times: number[] = [];
  for (let i = 0; i < count; i += 1) {
    const t0 = performance.now();
    await run();
    times.push(performance.now() - t0);
  }
  return times;
}
const describe = (times: number[]) => {
  times.sort((a, b) => a - b);
  return `p50 ${(percentile(times, 50) * 1000).toFixed(0)} µs, p95 ${(percentile(times, 95) * 1000).toFixed(0)} µs`;
};

console.log('\nNamed prepared statements against unnamed ones, one connection (10 rounds of 100 each; forced generic plans 2 of 10):');
for (const [mode, setting] of [
  ['plan_cache_mode auto (the default)', 'auto'],
  ['plan_cache_mode force_generic_plan', 'force_generic_plan'],
] as const) {
  await client.query(`DEALLOCATE ALL`);
  await client.query(`SET plan_cache_mode = ${setting}`);
  console.log(`  ${mode}`);
  for (const [k, s] of statements.entries()) {
    const named: number[] = [];
    const unnamed: number[] = [];
    const name = `bench_${setting}_${k}`;
    // A forced generic plan can be slow (availability: 15 ms at 20,000 assets, 93 ms at 100,000): fewer runs there.
    const [rounds, perRound] = setting === 'auto' ? [10, 100] : [2, 10];
    for (let round = 0; round < rounds; round += 1) {
      named.push(...(await timed(() => client.query({ name, text: s.text, values: s.values }), perRound)));
      unnamed.push(...(await timed(() => client.query(s.text, s.values), perRound)));
    }
    const [plans] = (await client.query(`SELECT generic_plans, custom_plans FROM pg_prepared_statements WHERE name = $1`, [name])).rows;
    console.log(
      `    ${s.name.padEnd(14)} named ${describe(named)} | unnamed ${describe(unnamed)} | named runs planned: ${plans.generic_plans} generic, ${plans.custom_plans} custom`,
    );
  }
}
await client.end();
