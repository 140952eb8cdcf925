// Steps shared by `npm start` and `npm test`: dependencies, database, client build.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { projectRoot } from './local-env.mjs';

export const log = (msg) => console.log(`[nestkeeper] ${msg}`);

/** `npm ci` when node_modules is missing or older than the lock file. */
export function ensureDependencies() {
  const marker = path.join(projectRoot, 'node_modules/.package-lock.json');
  const lock = path.join(projectRoot, 'package-lock.json');
  if (fs.existsSync(marker) && fs.statSync(marker).mtimeMs >= fs.statSync(lock).mtimeMs) return;
  log('Installing dependencies (npm ci)…');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: projectRoot, stdio: 'inherit' });
  if (r.status !== 0) throw new Error('npm ci failed; see the output above.');
}

/** Create the named database when it does not exist yet. */
export async function ensureDatabase(serverUrl, name) {
  const { default: pg } = await import('pg');
  const client = new pg.Client({ connectionString: `${serverUrl}/postgres` });
  await client.connect();
  try {
    const { rowCount } = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (!rowCount) await client.query(`CREATE DATABASE "${name.replace(/"/g, '')}"`);
  } finally {
    await client.end();
  }
  return `${serverUrl}/${name}`;
}

function newestMtime(entry) {
  if (!fs.existsSync(entry)) return 0;
  const stat = fs.statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return fs.readdirSync(entry).reduce((max, child) => Math.max(max, newestMtime(path.join(entry, child))), stat.mtimeMs);
}

/** Build the client when the build is missing or older than its sources. */
export function ensureClientBuild() {
  const built = path.join(projectRoot, 'dist/client/index.html');
  const sources = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'package-lock.json'].map((p) => path.join(projectRoot, p));
  const builtAt = fs.existsSync(built) ? fs.statSync(built).mtimeMs : 0;
  if (builtAt > Math.max(...sources.map(newestMtime))) return;
  log('Building the web client…');
  const r = spawnSync(process.execPath, [path.join(projectRoot, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'], {
    cwd: projectRoot,
    stdio: 'inherit',
  });
  if (r.status !== 0) throw new Error('The client build failed; see the output above.');
}

/** Run a TypeScript entry with tsx and wait for it. */
export function runTs(file, env, args = []) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', file, ...args], { cwd: projectRoot, stdio: 'inherit', env });
  if (r.status !== 0) throw new Error(`${file} failed (exit ${r.status})`);
}

/** Wait until the server on this port answers its health check (up to a minute). */
export async function waitForHealth(webPort) {
  for (let i = 0; i < 120; i += 1) {
    try {
      const res = await fetch(`http://127.0.0.1:${webPort}/api/health`);
      if (res.ok) return;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error('The server did not answer within a minute.');
}
