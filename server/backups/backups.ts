import { mkdir, readdir, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import pg from 'pg';
import { backupsToDelete, type RetentionPolicy } from '../../shared/backups/retention';
import { databaseName, runPgTool, withDatabase } from './pg-tools';

export type BackupTaken = { file: string; bytes: number; entries: number; tables: number; seconds: number };

const PREFIX = 'nestkeeper-';
const SUFFIX = '.dump';

/** `nestkeeper-20261203T023000Z.dump`: sorts by time and says when it was taken (UTC). */
const fileNameAt = (t: Date) =>
  `${PREFIX}${t
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z')}${SUFFIX}`;

function takenAtOf(name: string): Date | null {
  const m = /^nestkeeper-(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z\.dump$/.exec(name);
  return m ? new Date(Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5], +m[6])) : null;
}

/** What pg_restore --list says a dump holds: every entry, and the tables whose rows it carries. */
export async function listBackup(pgBin: string, file: string): Promise<{ entries: number; tables: string[] }> {
  const toc = await runPgTool(pgBin, 'pg_restore', 'postgres://localhost/postgres', ['--list', file]);
  const lines = toc.split('\n').filter((l) => /^\d+;/.test(l));
  const tables = lines.map((l) => / TABLE DATA \S+ (\S+) /.exec(l)?.[1]).filter((t): t is string => !!t);
  return { entries: lines.length, tables };
}

/**
 * A consistent dump of the whole database (pg_dump's custom format, one snapshot; certificates and photos are rows,
 * so they are in it), written beside its final name and moved there only once pg_restore can list it and it carries
 * the schema's migration log.
 */
export async function takeBackup(opts: { databaseUrl: string; dir: string; pgBin: string; now?: Date }): Promise<BackupTaken> {
  const started = performance.now();
  await mkdir(opts.dir, { recursive: true });
  const file = path.resolve(opts.dir, fileNameAt(opts.now ?? new Date()));
  const partial = `${file}.partial`;
  try {
    await runPgTool(opts.pgBin, 'pg_dump', opts.databaseUrl, ['--format=custom', '--compress=6', '--file', partial, databaseName(opts.databaseUrl)]);
    const listed = await listBackup(opts.pgBin, partial);
    if (!listed.tables.includes('schema_migrations')) throw new Error(`the dump of ${databaseName(opts.databaseUrl)} lists no schema_migrations rows`);
    await rename(partial, file);
    return { file, bytes: (await stat(file)).size, entries: listed.entries, tables: listed.tables.length, seconds: (performance.now() - started) / 1000 };
  } finally {
    await rm(partial, { force: true });
  }
}

/** Delete the backups in `dir` the retention policy no longer keeps; returns the names deleted. */
export async function pruneBackups(dir: string, policy: RetentionPolicy, now = new Date()): Promise<string[]> {
  const names = await readdir(dir).catch(() => [] as string[]);
  const dated = names.flatMap((name) => {
    const takenAt = takenAtOf(name);
    return takenAt ? [{ name, takenAt }] : [];
  });
  const doomed = backupsToDelete(dated, policy, now);
  for (const b of doomed) await rm(path.join(dir, b.name));
  return doomed.map((b) => b.name);
}

export class RestoreRefused extends Error {}

async function withClient<T>(url: string, work: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

/** Tables in the database's public schema. */
const tableCount = (url: string) =>
  withClient(url, async (c) => Number((await c.query(`SELECT count(*) AS n FROM pg_tables WHERE schemaname = 'public'`)).rows[0].n));

/**
 * Restore a dump into the database of `databaseUrl` when it is empty (no tables), or with `force` after emptying it;
 * with `newDatabase` into a database of that name created for it (refused if one exists). All or nothing: one transaction.
 * Returns the URL restored into.
 */
export async function restoreBackup(opts: {
  file: string;
  databaseUrl: string;
  pgBin: string;
  force?: boolean;
  newDatabase?: string;
}): Promise<{ databaseUrl: string; entries: number; seconds: number }> {
  const started = performance.now();
  const listed = await listBackup(opts.pgBin, opts.file);
  let target = opts.databaseUrl;
  if (opts.newDatabase) {
    const name = opts.newDatabase;
    if (!/^[a-z_][a-z0-9_]{0,62}$/.test(name)) throw new RestoreRefused(`"${name}" is not a database name Nestkeeper creates (lower-case letters, digits, _).`);
    await withClient(withDatabase(opts.databaseUrl, 'postgres'), async (c) => {
      if ((await c.query('SELECT 1 FROM pg_database WHERE datname = $1', [name])).rowCount)
        throw new RestoreRefused(`A database named ${name} exists already.`);
      await c.query(`CREATE DATABASE ${name}`);
    });
    target = withDatabase(opts.databaseUrl, name);
  } else if ((await tableCount(target)) > 0) {
    if (!opts.force)
      throw new RestoreRefused(
        `The database ${databaseName(target)} is not empty. Restore into a new database (--new), or add --force to replace everything in it.`,
      );
    await withClient(target, (c) => c.query('DROP SCHEMA public CASCADE; CREATE SCHEMA public'));
  }
  await runPgTool(opts.pgBin, 'pg_restore', target, [
    '--no-owner',
    '--no-privileges',
    '--exit-on-error',
    '--single-transaction',
    '--dbname',
    databaseName(target),
    opts.file,
  ]);
  return { databaseUrl: target, entries: listed.entries, seconds: (performance.now() - started) / 1000 };
}
