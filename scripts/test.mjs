// `npm test`: the type check (tsc --noEmit), the lint (import boundaries, layout), a throwaway PostgreSQL, the built client,
// Debian's Chromium, then every Vitest suite (unit, API, browser) with TZ=UTC, then the
// pure tests in shared/ again under other time zones. Ends with one line "N passed, M failed"
// (the type check counts as one) and exits non-zero on any failure.
// `npm test -- <paths>` runs only those (extra arguments go to Vitest) and skips the type
// check; when every path is under shared/ it needs no PostgreSQL, client build or Chromium.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { projectRoot } from './lib/local-env.mjs';
import { ensurePostgresInstalled, startCluster, stopCluster } from './lib/postgres.mjs';
import { ensureClientBuild, ensureDependencies, log } from './lib/steps.mjs';

const CHROMIUM = '/usr/bin/chromium';
// Date code must hold wherever the server or a browser runs: ahead of UTC across the date
// line (+12/+13 with daylight saving in the southern summer) and behind it (-8/-7).
const MAIN_TIME_ZONE = 'UTC';
const EXTRA_TIME_ZONES = ['Pacific/Auckland', 'America/Los_Angeles'];
// Vitest options whose value follows as the next argument, so it is not taken for a path.
const OPTIONS_WITH_VALUE = new Set(['-t', '--testNamePattern', '--project', '--shard', '--retry', '--bail', '--maxWorkers', '--reporter']);

function ensureChromium() {
  if (fs.existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) throw new Error(`Browser tests need Chromium at ${CHROMIUM}: sudo apt-get install -y chromium`);
  log('Installing Chromium from Debian packages for the browser tests (one time)…');
  for (const args of [
    ['update', '-qq'],
    ['install', '-y', '-qq', 'chromium'],
  ]) {
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

/** The arguments that name test files or folders, and the rest (Vitest options). */
function splitArguments(args) {
  const paths = [];
  const options = [];
  for (let i = 0; i < args.length; i += 1) {
    if (!args[i].startsWith('-')) paths.push(args[i]);
    else {
      options.push(args[i]);
      if (OPTIONS_WITH_VALUE.has(args[i]) && i + 1 < args.length) options.push(args[(i += 1)]);
    }
  }
  return { paths, options };
}

const underShared = (p) => {
  const relative = path.relative(projectRoot, path.resolve(projectRoot, p));
  return relative === 'shared' || relative.startsWith(`shared${path.sep}`);
};

let clusterDir = null;
let reportDir = null;
function stopTestCluster() {
  if (!clusterDir) return;
  stopCluster(clusterDir);
  fs.rmSync(clusterDir, { recursive: true, force: true });
  clusterDir = null;
}
function cleanUp() {
  stopTestCluster();
  if (reportDir) fs.rmSync(reportDir, { recursive: true, force: true });
  reportDir = null;
}

const tally = { passed: 0, failed: 0 };

/** Whole-project checks, each one line in the tally: the types, the import boundaries, the layout. */
const projectChecks = [
  ['Type check (tsc --noEmit)', 'typescript/bin/tsc', ['--noEmit']],
  ['Import boundaries (eslint)', 'eslint/bin/eslint.js', ['.']],
  ['Layout (prettier --check)', 'prettier/bin/prettier.cjs', ['--check', '--log-level', 'warn', '.']],
];

function checkProject() {
  for (const [label, bin, args] of projectChecks) {
    log(`${label}…`);
    const r = spawnSync(process.execPath, [path.join(projectRoot, 'node_modules', bin), ...args], { cwd: projectRoot, stdio: 'inherit' });
    if (r.status === 0) tally.passed += 1;
    else {
      log(`${label} failed; see above.`);
      tally.failed += 1;
    }
  }
}

/** One `vitest run`; its tests go into the tally. */
function vitest(label, args, env) {
  const report = path.join(reportDir, `vitest-${label.replace(/\W+/g, '-')}.json`);
  const run = spawnSync(
    process.execPath,
    [path.join(projectRoot, 'node_modules/vitest/vitest.mjs'), 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...args],
    { cwd: projectRoot, stdio: 'inherit', env: { ...env, NODE_OPTIONS: `${process.env.NODE_OPTIONS ?? ''} --import tsx`.trim() } },
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
  log(`${label}: ${passed} passed, ${failed} failed.`);
  tally.passed += passed;
  tally.failed += failed;
}

async function main() {
  const started = Date.now();
  const { paths, options } = splitArguments(process.argv.slice(2));
  const wholeSuite = paths.length === 0;
  const pureOnly = !wholeSuite && paths.every(underShared);
  const sharedPaths = wholeSuite ? ['shared/'] : paths.filter(underShared);
  // A cluster URL left in the shell would point the runs without PostgreSQL at it.
  const baseEnv = { ...process.env };
  delete baseEnv.TEST_PG_URL;

  ensureDependencies();
  reportDir = fs.mkdtempSync(path.join(os.tmpdir(), 'nestkeeper-reports-'));
  if (wholeSuite) checkProject();
  else log('Type check and lint skipped for a partial run (npm run typecheck, npm run lint).');

  const env = { ...baseEnv, TZ: MAIN_TIME_ZONE };
  if (pureOnly) log('Only shared/ requested: no PostgreSQL, client build or Chromium.');
  else {
    ensurePostgresInstalled(log);
    ensureChromium();
    ensureClientBuild();
    // Under the system temp dir: the postgres user can reach it wherever CI cloned us.
    clusterDir = fs.mkdtempSync(path.join(os.tmpdir(), 'nestkeeper-test-'));
    fs.chmodSync(clusterDir, 0o755);
    process.env.PG_FSYNC = 'off';
    env.TEST_PG_URL = startCluster({ dataDir: clusterDir, port: await freePort(), log });
    env.CHROMIUM_PATH = CHROMIUM;
    log('Throwaway PostgreSQL is up; running the suites…');
  }
  vitest(`TZ=${MAIN_TIME_ZONE}`, process.argv.slice(2), env);
  stopTestCluster();

  if (sharedPaths.length) {
    for (const timeZone of EXTRA_TIME_ZONES) {
      log(`The pure tests in shared/ again with TZ=${timeZone}…`);
      vitest(`shared/ TZ=${timeZone}`, [...options, ...sharedPaths], { ...baseEnv, TZ: timeZone });
    }
  }
  cleanUp();
  log(`Finished in ${Math.round((Date.now() - started) / 1000)} s.`);
  console.log(`${tally.passed} passed, ${tally.failed} failed`);
  process.exit(tally.failed > 0 ? 1 : 0);
}

for (const signal of ['SIGINT', 'SIGTERM'])
  process.on(signal, () => {
    cleanUp();
    process.exit(130);
  });
main().catch((err) => {
  console.error(`[nestkeeper] ${err.message}`);
  cleanUp();
  console.log(`${tally.passed} passed, ${tally.failed + 1} failed`);
  process.exit(1);
});
