// `npm run backup` and `npm run restore -- <file> [--new [name]] [--force]` (scripts/backup.mjs finds the database).
import { writeFileSync } from 'node:fs';
import { databaseName } from './pg-tools';
import { RestoreRefused, restoreBackup, takeBackup } from './backups';

const env = process.env;
const pgBin = env.PG_BIN ?? '/usr/lib/postgresql/15/bin';
const databaseUrl = env.DATABASE_URL;
const [command, ...args] = process.argv.slice(2);

const megabytes = (bytes: number) => `${(bytes / 1e6).toFixed(1)} MB`;

async function main() {
  if (!databaseUrl) throw new Error('DATABASE_URL is not set.');
  if (command === 'backup') {
    const dirAt = args.indexOf('--dir');
    const dir = dirAt >= 0 ? args[dirAt + 1] : (env.BACKUP_DIR ?? '.data/backups');
    const taken = await takeBackup({ databaseUrl, dir, pgBin });
    console.log(
      `Backed up ${databaseName(databaseUrl)} to ${taken.file}\n  ${megabytes(taken.bytes)}, ${taken.entries} entries (${taken.tables} tables with rows) listed back by pg_restore, ${taken.seconds.toFixed(1)} s`,
    );
    return;
  }
  if (command === 'restore') {
    const file = args.find((a) => !a.startsWith('--') && args[args.indexOf(a) - 1] !== '--new');
    if (!file) throw new RestoreRefused('Name the backup file: npm run restore -- .data/backups/nestkeeper-….dump');
    const newAt = args.indexOf('--new');
    const stamp = new Date().toISOString().replace(/[-:T]/g, '').slice(0, 12);
    const newDatabase = newAt < 0 ? undefined : args[newAt + 1] && !args[newAt + 1].startsWith('--') ? args[newAt + 1] : `nestkeeper_restored_${stamp}`;
    const restored = await restoreBackup({ file, databaseUrl, pgBin, force: args.includes('--force'), newDatabase });
    const name = databaseName(restored.databaseUrl);
    console.log(`Restored ${file} into ${name}: ${restored.entries} entries, ${restored.seconds.toFixed(1)} s`);
    if (newDatabase && env.NESTKEEPER_DATABASE_NAME_FILE) {
      writeFileSync(env.NESTKEEPER_DATABASE_NAME_FILE, `${name}\n`);
      console.log(`The next npm start uses ${name} (restart Nestkeeper now). The previous database is kept.`);
    } else if (newDatabase) {
      console.log(`Point DATABASE_URL at ${name} and restart every instance. The previous database is kept.`);
    }
    return;
  }
  throw new Error(`Unknown command "${command}" (backup, restore)`);
}

main().catch((err: unknown) => {
  console.error(err instanceof RestoreRefused ? `Not restored: ${err.message}` : err instanceof Error ? err.message : err);
  process.exit(err instanceof RestoreRefused ? 2 : 1);
});
