// `npm start`: everything from a fresh clone to a running Nestkeeper.
// `npm run dev` (--dev): the same database, Vite with hot reload, server in watch mode.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { LOCAL_PG_PORT, installationSecret, localDataDir, localDatabaseName, projectRoot } from './lib/local-env.mjs';
import { ensurePostgresInstalled, startCluster, stopCluster } from './lib/postgres.mjs';
import { ensureClientBuild, ensureDatabase, ensureDependencies, log, runTs, waitForHealth } from './lib/steps.mjs';

const dev = process.argv.includes('--dev');
const port = Number(process.env.PORT ?? 4600);
const children = [];
let clusterDir = null;

async function main() {
  ensureDependencies();
  // Log lines for a person at the terminal; set LOG_FORMAT=json for log tools.
  const env = { LOG_FORMAT: 'pretty', ...process.env, PORT: String(port), NODE_ENV: dev ? 'development' : 'production' };
  if (!env.DATABASE_URL) {
    ensurePostgresInstalled(log);
    clusterDir = localDataDir();
    const serverUrl = startCluster({ dataDir: clusterDir, port: LOCAL_PG_PORT, log });
    log(`PostgreSQL is running on 127.0.0.1:${LOCAL_PG_PORT} (data in ${path.join(clusterDir, 'pgdata')}).`);
    env.DATABASE_URL = await ensureDatabase(serverUrl, localDatabaseName(clusterDir));
    env.JWT_SECRET ??= installationSecret(clusterDir, 'jwt-secret');
    // The local payment fake signs its events with the same secret (server/index.ts hands it over).
    env.PAYMENT_WEBHOOK_SECRET ??= installationSecret(clusterDir, 'payment-webhook-secret', 'whsec_');
    // A scraper on another machine reads /metrics with this bearer token (this machine may read them without).
    env.METRICS_TOKEN ??= installationSecret(clusterDir, 'metrics-token');
  }
  if (!env.JWT_SECRET || !env.PAYMENT_WEBHOOK_SECRET) {
    throw new Error(
      "Set JWT_SECRET (32+ characters) and PAYMENT_WEBHOOK_SECRET (your payment provider's webhook signing secret) when DATABASE_URL points at your own PostgreSQL.",
    );
  }
  runTs('server/prepare.ts', env);

  const tsx = ['--import', 'tsx'];
  if (dev) {
    children.push(spawn(process.execPath, [...tsx, '--watch', 'server/index.ts'], { cwd: projectRoot, stdio: 'inherit', env }));
    children.push(spawn(process.execPath, ['node_modules/vite/bin/vite.js'], { cwd: projectRoot, stdio: 'inherit', env: { ...env, API_PORT: String(port) } }));
  } else {
    ensureClientBuild();
    children.push(spawn(process.execPath, [...tsx, 'server/index.ts'], { cwd: projectRoot, stdio: 'inherit', env }));
  }
  for (const child of children) child.on('exit', (code) => !stopping && void shutdown(`a server process ended (exit ${code})`, code ?? 1));
  await waitForHealth(port);
  const url = dev ? 'http://127.0.0.1:5173' : `http://127.0.0.1:${port}`;
  console.log(`
  Nestkeeper is running at ${url}

  Demo sign-ins (password for all: nestkeeper-demo)
    owner@demo.test     owner — overview, users, mailbox, routines
    manager@demo.test   shop manager — fleet, bookings, checkout and return
    tech@demo.test      field technician — my kit, checks, damage reports
    billing@demo.test   billing clerk — rentals, deposits, invoices
    owner@other.test    owner of a second firm (shows that firms are kept apart)

  Press Ctrl-C to stop; your data stays for the next start.
`);
}

let stopping = false;
async function shutdown(reason, code = 0) {
  if (stopping) return;
  stopping = true;
  log(`Stopping (${reason})…`);
  await Promise.all(
    children.map((c) =>
      c.exitCode !== null
        ? null
        : new Promise((resolve) => {
            c.once('exit', resolve);
            c.kill('SIGTERM');
          }),
    ),
  );
  if (clusterDir) {
    stopCluster(clusterDir);
    log('PostgreSQL stopped.');
  }
  process.exit(code);
}

process.on('SIGINT', () => void shutdown('Ctrl-C'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
main().catch((err) => {
  console.error(`\n[nestkeeper] ${err.message}\n`);
  void shutdown('start-up failed', 1);
});
