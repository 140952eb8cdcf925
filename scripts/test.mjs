// `npm test`: a throwaway PostgreSQL, the built client, Debian's Chromium, then
// every Vitest suite (unit, API, browser). Ends with one line "N passed, M failed".
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { projectRoot } from './lib/local-env.mjs';
import { ensurePostgresInstalled, startCluster, stopCluster } from './lib/postgres.mjs';
import { ensureClientBuild, ensureDependencies, log } from './lib/steps.mjs';

const CHROMIUM = '/usr/bin/chromium';

function ensureChromium() {
  if (fs.existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) throw new Error(`Browser tests need Chromium at ${CHROMIUM}: sudo apt-get install -y chromium`);
  log('Installing Chromium from Debian packages for the browser tests (one time)…');
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', 'chromium']]) {
    const r = spawnSync('apt-get', args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    if (r.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed`);
  }
}

const freePort = () =>
  new Promise((resolve, reject) => {
    const srv = net.createServer().once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });

let dataDir = null;
function cleanUp() {
  if (!dataDir) return;
  stopCluster(dataDir);
  fs.rmSync(dataDir, { recursive: true, force: true });
  dataDir = null;
}

async function main() {
  const started = Date.now();
  ensureDependencies();
  ensurePostgresInstalled(log);
  ensureChromium();
  ensureClientBuild();
  // Under the system temp dir: the postgres user can reach it wherever CI cloned us.
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'nestkeeper-test-'));
  fs.chmodSync(dataDir, 0o755);
  process.env.PG_FSYNC = 'off';
  const serverUrl = startCluster({ dataDir, port: await freePort(), log });
  log('Throwaway PostgreSQL is up; running the suites…');

  const report = path.join(dataDir, 'vitest-report.json');
  const run = spawnSync(
    process.execPath,
    [path.join(projectRoot, 'node_modules/vitest/vitest.mjs'), 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...process.argv.slice(2)],
    {
      cwd: projectRoot,
      stdio: 'inherit',
      env: { ...process.env, TEST_PG_URL: serverUrl, NODE_OPTIONS: `${process.env.NODE_OPTIONS ?? ''} --import tsx`.trim(), CHROMIUM_PATH: CHROMIUM },
    },
  );
  let passed = 0;
  let failed = 0;
  if (fs.existsSync(report)) {
    const r = JSON.parse(fs.readFileSync(report, 'utf8'));
    passed = r.numPassedTests;
    // A file that fails to load has no tests to count; it still counts as a failure.
    failed = r.numFailedTests + r.testResults.filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
  }
  if (run.status !== 0 && failed === 0) failed = 1;
  cleanUp();
  log(`Finished in ${Math.round((Date.now() - started) / 1000)} s.`);
  console.log(`${passed} passed, ${failed} failed`);
  process.exit(failed > 0 ? 1 : 0);
}

for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => { cleanUp(); process.exit(130); });
main().catch((err) => {
  console.error(`[nestkeeper] ${err.message}`);
  cleanUp();
  console.log('0 passed, 1 failed');
  process.exit(1);
});
