// `npm run backup` / `npm run restore -- <file> [--new [name]] [--force]`: on DATABASE_URL, or on the local
// installation's database (the cluster of `npm start`, started for the while if it is not running).
import fs from 'node:fs';
import path from 'node:path';
import { LOCAL_PG_PORT, localDataDir, localDatabaseName, projectRoot } from './lib/local-env.mjs';
import { clusterRunning, ensurePostgresInstalled, startCluster, stopCluster } from './lib/postgres.mjs';
import { log, runTs } from './lib/steps.mjs';

const env = { ...process.env };
let startedHere = null;
if (!env.DATABASE_URL) {
  ensurePostgresInstalled(log);
  const dataDir = localDataDir();
  if (!fs.existsSync(path.join(dataDir, 'pgdata', 'PG_VERSION'))) throw new Error('There is no local database yet: run npm start once first.');
  if (!clusterRunning(dataDir)) startedHere = dataDir;
  const serverUrl = startCluster({ dataDir, port: LOCAL_PG_PORT, log });
  env.DATABASE_URL = `${serverUrl}/${localDatabaseName(dataDir)}`;
  // A restore into a new database switches the local installation to it.
  env.NESTKEEPER_DATABASE_NAME_FILE = path.join(dataDir, 'database-name');
  env.BACKUP_DIR ??= path.join(projectRoot, '.data/backups');
}
try {
  runTs('server/backups/cli.ts', env, process.argv.slice(2));
} catch (err) {
  process.exitCode = 1;
  if (!String(err.message).includes('server/backups/cli.ts')) console.error(err.message);
} finally {
  if (startedHere) stopCluster(startedHere);
}
