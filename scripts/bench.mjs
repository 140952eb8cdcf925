// `npm run bench:<suite>`: load measurements on a throwaway cluster with the benchmark firm (20,000 assets by default;
// for bookings and calibration ten bookings per asset; for the audit pack a year of certificates). Each suite is one or
// more scripts in tests/bench/ run in turn against a live server; timings are printed here, never asserted in `npm test`.
//
// Scale: BENCH_ASSETS (assets) and BENCH_BOOKINGS_PER_ASSET (1–50, default 10). BENCH_DATA_DIR keeps the cluster in
// that folder instead of a throwaway one, so several suites can run on one seeded firm (the seeds skip what is there).
const suites = {
  fleet: { seed: [], run: ['tests/bench/fleet-load.ts'] },
  bookings: {
    seed: ['server/seed/seed-bench-bookings.ts'],
    run: ['tests/bench/bookings-load.ts', 'tests/bench/prepared-statements.ts', 'tests/bench/board-drawing.ts'],
  },
  calibration: { seed: ['server/seed/seed-bench-bookings.ts'], run: ['tests/bench/calibration-load.ts'] },
  // The reset limits are lifted so the rounds measure the answer, not the 429.
  accounts: {
    assets: 100,
    seed: [],
    run: ['tests/bench/password-reset-timing.ts'],
    env: { RESET_REQUESTS_PER_HOUR_PER_EMAIL: '100000', RESET_REQUESTS_PER_HOUR_PER_ADDRESS: '100000' },
  },
  'audit-pack': { seed: ['server/seed/seed-bench-records.ts'], run: ['tests/bench/audit-pack.ts'] },
};
const suite = suites[process.argv[2]];
if (!suite) {
  console.error(`Usage: node scripts/bench.mjs ${Object.keys(suites).join('|')}`);
  process.exit(2);
}
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { projectRoot } from './lib/local-env.mjs';
import { ensurePostgresInstalled, startCluster, stopCluster } from './lib/postgres.mjs';
import { ensureClientBuild, ensureDatabase, ensureDependencies, log, runTs, waitForHealth } from './lib/steps.mjs';

const freePort = () =>
  new Promise((resolve) => {
    const srv = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });

const keptDir = process.env.BENCH_DATA_DIR ? path.resolve(process.env.BENCH_DATA_DIR) : null;
if (keptDir) fs.mkdirSync(keptDir, { recursive: true });
const dataDir = keptDir ?? fs.mkdtempSync(path.join(os.tmpdir(), 'nestkeeper-bench-'));
fs.chmodSync(dataDir, 0o755);
let server;
const cleanUp = () => {
  server?.kill('SIGTERM');
  stopCluster(dataDir);
  if (!keptDir) fs.rmSync(dataDir, { recursive: true, force: true });
};

try {
  ensureDependencies();
  ensurePostgresInstalled(log);
  ensureClientBuild();
  const url = await ensureDatabase(startCluster({ dataDir, port: await freePort(), log }), 'nestkeeper');
  const port = await freePort();
  const env = {
    ...process.env,
    DATABASE_URL: url,
    JWT_SECRET: randomBytes(48).toString('base64url'),
    PAYMENT_WEBHOOK_SECRET: `whsec_${randomBytes(32).toString('base64url')}`,
    PORT: String(port),
    START_LOCAL_FAKES: 'false',
    RUN_SCHEDULER: 'false',
    NODE_ENV: 'production',
    ...suite.env,
  };
  runTs('server/prepare.ts', env);
  env.BENCH_ASSETS = process.env.BENCH_ASSETS ?? String(suite.assets ?? 20_000);
  runTs('server/seed/seed-bench-fleet.ts', env);
  for (const seed of suite.seed) runTs(seed, env);
  runTs('tests/bench/analyze.ts', env);
  server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: projectRoot, env, stdio: 'inherit' });
  await waitForHealth(port);
  let code = 0;
  for (const script of suite.run) {
    const child = spawn(process.execPath, ['--import', 'tsx', script], {
      cwd: projectRoot,
      env: { ...env, BENCH_URL: `http://127.0.0.1:${port}`, BENCH_SERVER_PID: String(server.pid) },
      stdio: 'inherit',
    });
    code = (await new Promise((r) => child.on('exit', r))) ?? 1;
    if (code !== 0) break;
  }
  cleanUp();
  process.exit(code);
} catch (err) {
  console.error(err);
  cleanUp();
  process.exit(1);
}
