// `npm run bench:backups`: backup and restore times on a throwaway cluster, for the demo firms alone and again
// after the 20,000-asset benchmark firm is added (npm run seed:bench). Prints figures; asserts nothing.
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { ensurePostgresInstalled, startCluster, stopCluster } from './lib/postgres.mjs';
import { ensureDatabase, ensureDependencies, log, runTs } from './lib/steps.mjs';

const freePort = () =>
  new Promise((resolve) => {
    const srv = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'nestkeeper-bench-backups-'));
fs.chmodSync(dataDir, 0o755);
const backups = path.join(dataDir, 'backups');
try {
  ensureDependencies();
  ensurePostgresInstalled(log);
  const serverUrl = startCluster({ dataDir, port: await freePort(), log });
  const env = {
    ...process.env,
    DATABASE_URL: await ensureDatabase(serverUrl, 'nestkeeper'),
    JWT_SECRET: randomBytes(48).toString('base64url'),
    PAYMENT_WEBHOOK_SECRET: `whsec_${randomBytes(32).toString('base64url')}`,
    BACKUP_DIR: backups,
  };
  runTs('server/prepare.ts', env);
  const round = (label, n) => {
    log(`${label}: backup`);
    runTs('server/backups/cli.ts', env, ['backup']);
    const file = path.join(backups, fs.readdirSync(backups).sort().at(-1));
    log(`${label}: restore into a new database`);
    runTs('server/backups/cli.ts', env, ['restore', file, '--new', `restored_${n}`]);
  };
  round('demo firms', 'demo');
  runTs('server/seed/seed-bench-fleet.ts', env);
  round('demo firms + 20,000-asset benchmark firm', 'bench');
} finally {
  stopCluster(dataDir);
  fs.rmSync(dataDir, { recursive: true, force: true });
}
