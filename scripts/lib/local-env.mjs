// Where the embedded setup keeps its data and secrets, and the settings the
// server gets from it. Shared by `npm start`, `npm run dev` and the migration script.
import { createHash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { reachableByServerUser } from './postgres.mjs';

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const LOCAL_PG_PORT = Number(process.env.NESTKEEPER_PG_PORT ?? 4632);

/** `.data/` in the checkout, or — when the postgres user cannot reach the
 * checkout — a folder under /var/lib named after the checkout's path. */
export function localDataDir() {
  const inCheckout = path.join(projectRoot, '.data');
  fs.mkdirSync(inCheckout, { recursive: true });
  if (reachableByServerUser(inCheckout)) return inCheckout;
  const tag = createHash('sha256').update(projectRoot).digest('hex').slice(0, 12);
  const fallback = path.join(fs.existsSync('/var/lib/postgresql') ? '/var/lib/postgresql' : os.tmpdir(), `nestkeeper-${tag}`);
  fs.mkdirSync(fallback, { recursive: true });
  fs.writeFileSync(
    path.join(inCheckout, 'WHERE-THE-DATA-IS.txt'),
    `The database cluster lives in ${fallback} because the postgres user cannot reach this folder.\n`,
  );
  return fallback;
}

/** A secret of this installation (the token-signing key, the payment webhook secret), created once
 * beside the data and kept across restarts: never built in, so no two installations share one. */
export function installationSecret(dataDir, name, prefix = '') {
  const file = path.join(dataDir, name);
  if (!fs.existsSync(file)) fs.writeFileSync(file, prefix + randomBytes(48).toString('base64url'), { mode: 0o600 });
  return fs.readFileSync(file, 'utf8').trim();
}

/** The database the local installation uses: `nestkeeper`, or the one `npm run restore -- <file> --new` switched to. */
export function localDatabaseName(dataDir) {
  const file = path.join(dataDir, 'database-name');
  return fs.existsSync(file) ? fs.readFileSync(file, 'utf8').trim() : 'nestkeeper';
}

/** Make the next `npm start` use another database of the local cluster. */
export function switchLocalDatabase(dataDir, name) {
  fs.writeFileSync(path.join(dataDir, 'database-name'), `${name}\n`);
}
