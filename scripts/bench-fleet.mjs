// `npm run bench:fleet`: the fleet register under load, on a throwaway cluster.
// 20,000 assets; GET /api/assets with a filter and a search term from 20
// concurrent clients (autocannon); then the fleet page in headless Chromium.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { projectRoot } from './lib/local-env.mjs';
import { ensurePostgresInstalled, startCluster, stopCluster } from './lib/postgres.mjs';
import { ensureClientBuild, ensureDatabase, ensureDependencies, log, runTs } from './lib/steps.mjs';

const freePort = () =>
  new Promise((resolve) => {
    const srv = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'nestkeeper-bench-'));
fs.chmodSync(dataDir, 0o755);
let server;
const cleanUp = () => {
  server?.kill('SIGTERM');
  stopCluster(dataDir);
  fs.rmSync(dataDir, { recursive: true, force: true });
};

try {
  ensureDependencies();
  ensurePostgresInstalled(log);
  ensureClientBuild();
  const url = await ensureDatabase(startCluster({ dataDir, port: await freePort(), log }), 'nestkeeper');
  const port = await freePort();
  const env = { ...process.env, DATABASE_URL: url, JWT_SECRET: 'bench-secret-bench-secret-bench-secret', PORT: String(port), START_LOCAL_FAKES: 'false', RUN_SCHEDULER: 'false', NODE_ENV: 'production' };
  runTs('server/db/prepare.ts', env);
  runTs('server/seed/seed-bench-fleet.ts', env);
  runTs('tests/bench/analyze.ts', env);
  server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: projectRoot, env, stdio: 'inherit' });
  await new Promise((r) => setTimeout(r, 4000));
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/bench/fleet-load.ts'], { cwd: projectRoot, env: { ...env, BENCH_URL: `http://127.0.0.1:${port}` }, stdio: 'inherit' });
  const code = await new Promise((r) => child.on('exit', r));
  cleanUp();
  process.exit(code ?? 1);
} catch (err) {
  console.error(err);
  cleanUp();
  process.exit(1);
}
