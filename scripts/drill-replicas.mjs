// `npm run drill:replicas` (not part of npm test): three Nestkeeper instances on one throwaway PostgreSQL behind
// Debian's nginx, configured with the same proxy part as docker/ (docker/nginx/nestkeeper-proxy.conf, and the
// upstream's parameters read from docker/nginx.conf). A bounded load of reads and writes (bookings, two-face checks)
// runs through nginx; one instance is killed (SIGKILL) part-way and started again, as compose's restart policy would.
// Prints requests failed, writes acknowledged and found afterwards, and the time until the pool is whole again.
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { projectRoot } from './lib/local-env.mjs';
import { ensurePostgresInstalled, startCluster, stopCluster } from './lib/postgres.mjs';
import { ensureDatabase, ensureDependencies, log, runTs } from './lib/steps.mjs';

const INSTANCES = 3;
const LOAD_SECONDS = Number(process.env.DRILL_SECONDS ?? 40);
const KILL_AFTER_SECONDS = Number(process.env.DRILL_KILL_AFTER ?? 12);
const USERS = Number(process.env.DRILL_USERS ?? 8);
const NGINX = '/usr/sbin/nginx';

const freePort = () =>
  new Promise((resolve) => {
    const srv = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

function ensureNginx() {
  if (fs.existsSync(NGINX)) return;
  if (process.getuid?.() !== 0) throw new Error('The drill needs nginx: sudo apt-get install -y nginx');
  log('Installing nginx from Debian packages (one time)…');
  const r = spawnSync('apt-get', ['install', '-y', '-qq', 'nginx'], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  if (r.status !== 0) throw new Error('apt-get install nginx failed');
}

/** nginx.conf for the drill: docker/nginx.conf's upstream parameters over loopback ports, docker's shared proxy part. */
function nginxConfig(dir, listenPort, appPorts) {
  const docker = fs.readFileSync(path.join(projectRoot, 'docker/nginx.conf'), 'utf8');
  const serverParams = /server\s+app:\d+\s+resolve\s+([^;]*);/.exec(docker)?.[1] ?? '';
  const keepalive = /keepalive\s+(\d+);/.exec(docker)?.[1] ?? '32';
  const temp = ['client_body', 'proxy', 'fastcgi', 'uwsgi', 'scgi'].map((t) => {
    const p = path.join(dir, 'nginx-temp', t);
    fs.mkdirSync(p, { recursive: true, mode: 0o777 });
    return `${t}_temp_path ${p};`;
  });
  return `
worker_processes 1;
pid ${dir}/nginx.pid;
error_log ${dir}/nginx-error.log warn;
daemon off;
${process.getuid?.() === 0 ? 'user root;' : ''}
events { worker_connections 1024; }
http {
  access_log off;
  ${temp.join('\n  ')}
  upstream nestkeeper_app {
    ${appPorts.map((p) => `server 127.0.0.1:${p} ${serverParams};`).join('\n    ')}
    keepalive ${keepalive};
  }
  server {
    listen 127.0.0.1:${listenPort};
    include ${path.join(projectRoot, 'docker/nginx/nestkeeper-proxy.conf')};
  }
}
`;
}

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'nestkeeper-drill-'));
fs.chmodSync(dataDir, 0o755);
const instances = [];
let nginx = null;

function startInstance(env, port, index) {
  const out = fs.openSync(path.join(dataDir, `app-${index}.log`), 'a');
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: projectRoot,
    env: { ...env, PORT: String(port) },
    stdio: ['ignore', out, out],
  });
  instances[index] = { child, port };
  return child;
}

async function until(what, probe, timeoutMs = 120_000) {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    if (await probe().catch(() => false)) return Date.now();
    await sleep(50);
  }
  throw new Error(`${what} did not happen within ${timeoutMs / 1000} s`);
}

const ready = (port) => fetch(`http://127.0.0.1:${port}/api/ready`).then((r) => r.ok);

/** Requests the instance served for others, from its own /metrics (loopback): the drill's own polls do not count. */
async function servedThrough(port) {
  const text = await (await fetch(`http://127.0.0.1:${port}/metrics`)).text();
  let n = 0;
  for (const m of text.matchAll(/^nestkeeper_http_requests_total\{[^}]*route="([^"]+)"[^}]*\} (\d+)/gm))
    if (m[1] !== '/api/ready' && m[1] !== '/metrics') n += Number(m[2]);
  return n;
}

function cleanUp() {
  for (const i of instances) i?.child.exitCode === null && i.child.kill('SIGTERM');
  nginx?.exitCode === null && nginx.kill('SIGQUIT');
  stopCluster(dataDir);
  fs.rmSync(dataDir, { recursive: true, force: true });
}

const quantile = (xs, q) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.floor(q * s.length))] : NaN;
};
const isoDay = (offset) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

async function main() {
  ensureDependencies();
  ensurePostgresInstalled(log);
  ensureNginx();
  const url = await ensureDatabase(startCluster({ dataDir, port: await freePort(), log }), 'nestkeeper');
  const env = {
    ...process.env,
    DATABASE_URL: url,
    JWT_SECRET: randomBytes(48).toString('base64url'),
    PAYMENT_WEBHOOK_SECRET: `whsec_${randomBytes(32).toString('base64url')}`,
    START_LOCAL_FAKES: 'false',
    RUN_SCHEDULER: 'true',
    NIGHTLY_BACKUP: 'false',
    SMTP_PORT: '9',
    NODE_ENV: 'production',
    TRUST_PROXY: 'loopback',
    LOG_LEVEL: 'warn',
    LOG_FORMAT: 'json',
  };
  runTs('server/prepare.ts', env);

  const appPorts = [];
  for (let i = 0; i < INSTANCES; i += 1) appPorts.push(await freePort());
  appPorts.forEach((port, i) => startInstance(env, port, i));
  await Promise.all(appPorts.map((p) => until(`instance on ${p} ready`, () => ready(p))));
  const proxyPort = await freePort();
  const confFile = path.join(dataDir, 'nginx.conf');
  fs.writeFileSync(confFile, nginxConfig(dataDir, proxyPort, appPorts));
  execFileSync(NGINX, ['-t', '-q', '-c', confFile, '-p', dataDir], { stdio: 'inherit' });
  nginx = spawn(NGINX, ['-c', confFile, '-p', dataDir], { stdio: 'inherit' });
  const base = `http://127.0.0.1:${proxyPort}`;
  await until('nginx answering', () => ready(proxyPort));
  log(
    `Three instances (${appPorts.join(', ')}) behind nginx on ${proxyPort}; ${USERS} people for ${LOAD_SECONDS} s, one instance killed after ${KILL_AFTER_SECONDS} s.`,
  );

  const signIn = async (email) => {
    const res = await fetch(`${base}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email, password: 'nestkeeper-demo' }),
    });
    if (!res.ok) throw new Error(`sign-in as ${email}: ${res.status}`);
    return { Authorization: `Bearer ${(await res.json()).token}`, 'Content-Type': 'application/json' };
  };
  const manager = await signIn('manager@demo.test');
  const tech = await signIn('tech@demo.test');
  // Writes that should all succeed: each books one item free on one day (from availability), or records a passing two-face check.
  const slots = [];
  for (let d = 20; d < 60 && slots.length < 2000; d += 1) {
    const day = isoDay(d);
    const res = await fetch(`${base}/api/availability?startsOn=${day}&endsOn=${day}&limit=500`, { headers: manager });
    for (const a of (await res.json()).items) slots.push({ assetId: a.id, day });
  }
  const trackers = (await (await fetch(`${base}/api/assets?type=tracker&status=ready&limit=50`, { headers: tech })).json()).items.map((a) => a.id);

  const results = [];
  const acknowledged = { bookings: [], checks: [] };
  const unanswered = { bookings: 0, checks: 0 };
  const refusals = new Map(); // a write the app refused (4xx): what it said, once per kind of refusal
  const reads = [`/api/assets?limit=20`, `/api/bookings?from=${isoDay(0)}&to=${isoDay(30)}`, `/api/calibration/due?withinDays=30`, `/api/kits`];
  const started = Date.now();
  const stopAt = started + LOAD_SECONDS * 1000;
  let killedAt = null;
  let readyAgainAt = null;
  let servingAgainAt = null;

  async function person(n) {
    let i = 0;
    while (Date.now() < stopAt) {
      i += 1;
      const pick = (n + i) % 4;
      let kind = 'read';
      let request;
      if (pick === 2 && slots.length) {
        kind = 'booking';
        const slot = slots.pop();
        request = [
          `${base}/api/bookings`,
          { method: 'POST', headers: manager, body: JSON.stringify({ assetIds: [slot.assetId], startsOn: slot.day, endsOn: slot.day, note: 'replica drill' }) },
        ];
      } else if (pick === 3 && trackers.length) {
        kind = 'check';
        const p = { x: 1000 + i, y: 2000, z: 300 };
        const body = {
          kind: 'two_face',
          assetId: trackers[i % trackers.length],
          distanceM: 5,
          front: p,
          back: { ...p, x: p.x + 0.002 },
          note: 'replica drill',
        };
        request = [`${base}/api/checks`, { method: 'POST', headers: tech, body: JSON.stringify(body) }];
      } else request = [`${base}${reads[i % reads.length]}`, { headers: manager }];
      const t0 = performance.now();
      let status = 0;
      try {
        const res = await fetch(...request);
        status = res.status;
        const body = await res.json().catch(() => null);
        if (kind !== 'read' && res.status === 201) acknowledged[kind === 'booking' ? 'bookings' : 'checks'].push(body.id);
        if (res.status >= 400 && res.status < 500) refusals.set(`${kind} ${res.status}`, JSON.stringify(body?.error ?? body).slice(0, 300));
      } catch {
        status = 0;
      }
      if (kind !== 'read' && status !== 201) unanswered[kind === 'booking' ? 'bookings' : 'checks'] += 1;
      results.push({ kind, status, ms: performance.now() - t0 });
      await sleep(25);
    }
  }

  async function killOne() {
    await sleep(KILL_AFTER_SECONDS * 1000);
    const victim = instances[1];
    killedAt = Date.now();
    victim.child.kill('SIGKILL');
    await new Promise((r) => (victim.child.exitCode !== null ? r() : victim.child.once('exit', r)));
    const child = startInstance(env, victim.port, 1);
    readyAgainAt = await until('the restarted instance ready', () => child.exitCode === null && ready(victim.port));
    servingAgainAt = await until('nginx sending work to it again', async () => (await servedThrough(victim.port)) > 0);
  }

  await Promise.all([...Array.from({ length: USERS }, (_, n) => person(n)), killOne()]);
  const seconds = (Date.now() - started) / 1000;

  // What the database holds afterwards.
  const { default: pg } = await import('pg');
  const db = new pg.Client({ connectionString: url });
  await db.connect();
  const found = async (table, ids) => Number((await db.query(`SELECT count(*) AS n FROM ${table} WHERE id = ANY($1::uuid[])`, [ids])).rows[0].n);
  const bookingsFound = await found('bookings', acknowledged.bookings);
  const checksFound = await found('field_checks', acknowledged.checks);
  const bookingsStored = Number((await db.query(`SELECT count(*) AS n FROM bookings WHERE note = 'replica drill'`)).rows[0].n);
  const checksStored = Number((await db.query(`SELECT count(*) AS n FROM field_checks WHERE note = 'replica drill'`)).rows[0].n);
  await db.end();

  const failed = results.filter((r) => r.status === 0 || r.status >= 500);
  const byStatus = {};
  for (const r of results) byStatus[r.status] = (byStatus[r.status] ?? 0) + 1;
  const writes = results.filter((r) => r.kind !== 'read');
  console.log(`
Replica drill: ${INSTANCES} instances behind ${spawnSync(NGINX, ['-v'], { encoding: 'utf8' }).stderr.trim().replace('nginx version: ', '')}
  load                 ${results.length} requests in ${seconds.toFixed(1)} s (${(results.length / seconds).toFixed(0)}/s) from ${USERS} people; ${writes.length} writes
  answers              ${Object.entries(byStatus)
    .map(([s, n]) => `${s === '0' ? 'no answer' : s}: ${n}`)
    .join(', ')}
  requests failed      ${failed.length} (${failed.filter((r) => r.kind !== 'read').length} of them writes)
  latency              p50 ${quantile(
    results.map((r) => r.ms),
    0.5,
  ).toFixed(0)} ms, p95 ${quantile(
    results.map((r) => r.ms),
    0.95,
  ).toFixed(0)} ms, max ${Math.max(...results.map((r) => r.ms)).toFixed(0)} ms
  bookings             ${acknowledged.bookings.length} acknowledged, ${bookingsFound} found afterwards (${acknowledged.bookings.length - bookingsFound} lost); ${unanswered.bookings} not acknowledged, ${bookingsStored - bookingsFound} of those stored anyway
  two-face checks      ${acknowledged.checks.length} acknowledged, ${checksFound} found afterwards (${acknowledged.checks.length - checksFound} lost); ${unanswered.checks} not acknowledged, ${checksStored - checksFound} of those stored anyway
${[...refusals].map(([k, v]) => `  refused (${k})   ${v}\n`).join('')}  instance killed      at ${((killedAt - started) / 1000).toFixed(1)} s; restarted and ready ${((readyAgainAt - killedAt) / 1000).toFixed(1)} s later; nginx sent it work again ${((servingAgainAt - killedAt) / 1000).toFixed(1)} s after the kill (pool whole again)
`);
  return acknowledged.bookings.length - bookingsFound + (acknowledged.checks.length - checksFound) === 0 ? 0 : 1;
}

main().then(
  (code) => {
    cleanUp();
    process.exit(code);
  },
  (err) => {
    console.error(err);
    cleanUp();
    process.exit(1);
  },
);
