/** Backups: pg_dump / pg_restore of the whole database, the nightly routine and its retention. */
export { backupRoutine } from './backup.routine';
