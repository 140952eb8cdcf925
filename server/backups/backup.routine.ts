import path from 'node:path';
import type { RetentionPolicy } from '../../shared/backups/retention';
import type { Routine } from '../routines';
import { pruneBackups, takeBackup } from './backups';

export type BackupSettings = { databaseUrl: string; dir: string; pgBin: string; keep: RetentionPolicy };

/**
 * The nightly backup of the whole installation (every firm: one database), then the retention policy over the folder.
 * Claimed in PostgreSQL like every routine, so one instance takes it; the folder should be one they share (docker/).
 */
export const backupRoutine = (settings: BackupSettings): Routine => ({
  name: 'nightly-backup',
  description: `Backs up the database (certificates and photos included) and keeps the last ${settings.keep.daily} nights and ${settings.keep.weekly} weeks.`,
  schedule: '0 30 2 * * *',
  run: async ({ now, log }) => {
    const taken = await takeBackup({ databaseUrl: settings.databaseUrl, dir: settings.dir, pgBin: settings.pgBin, now });
    const deleted = await pruneBackups(settings.dir, settings.keep, now);
    log?.info({ file: taken.file, bytes: taken.bytes, seconds: taken.seconds, deleted }, 'backup taken');
    return { file: path.basename(taken.file), megabytes: Math.round(taken.bytes / 1e5) / 10, entries: taken.entries, deleted: deleted.length };
  },
});
