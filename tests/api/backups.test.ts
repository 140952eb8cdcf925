import { mkdtemp, readdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listBackup, pruneBackups, RestoreRefused, restoreBackup, takeBackup } from '../../server/backups/backups';
import { createTestDatabase } from '../support/test-db';

const PG_BIN = '/usr/lib/postgresql/15/bin';

async function query<T>(url: string, sql: string): Promise<T[]> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    return (await c.query(sql)).rows as T[];
  } finally {
    await c.end();
  }
}

/** Every table's row count and a digest of all its rows (files included: certificates and photos are bytea columns). */
async function fingerprint(url: string): Promise<Record<string, string>> {
  const tables = await query<{ tablename: string }>(url, `SELECT tablename FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename`);
  const out: Record<string, string> = {};
  for (const { tablename } of tables) {
    const [row] = await query<{ n: string; digest: string | null }>(
      url,
      `SELECT count(*) AS n, md5(string_agg(t::text, '|' ORDER BY t::text)) AS digest FROM "${tablename}" t`,
    );
    out[tablename] = `${row.n}:${row.digest}`;
  }
  return out;
}

describe('backups restore', () => {
  let source: Awaited<ReturnType<typeof createTestDatabase>>;
  let dir: string;
  let file: string;
  const made: string[] = [];
  beforeAll(async () => {
    source = await createTestDatabase({ seed: true });
    dir = await mkdtemp(path.join(os.tmpdir(), 'nk-backups-'));
  });
  afterAll(async () => {
    for (const name of made) await query(`${process.env.TEST_PG_URL}/postgres`, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await source?.drop();
    if (dir) await rm(dir, { recursive: true, force: true });
  });

  it('takes a custom-format dump named by time and lists it back (pg_restore --list)', async () => {
    const taken = await takeBackup({ databaseUrl: source.url, dir, pgBin: PG_BIN, now: new Date('2026-12-03T02:30:00Z') });
    file = taken.file;
    expect(path.basename(file)).toBe('nestkeeper-20261203T023000Z.dump');
    expect(await readdir(dir)).toEqual([path.basename(file)]); // no partial file left behind
    const listed = await listBackup(PG_BIN, file);
    expect(listed.tables).toEqual(expect.arrayContaining(['certificate_files', 'assets', 'bookings', 'schema_migrations']));
    expect(taken.entries).toBe(listed.entries);
  });

  it('restores into a new database with the same rows and the same certificate files, byte for byte', async () => {
    const name = `nk_restored_${Date.now().toString(36)}`;
    made.push(name);
    const restored = await restoreBackup({ file, databaseUrl: source.url, pgBin: PG_BIN, newDatabase: name });
    expect(new URL(restored.databaseUrl).pathname).toBe(`/${name}`);
    const [before, after] = [await fingerprint(source.url), await fingerprint(restored.databaseUrl)];
    expect(Object.keys(after)).toEqual(Object.keys(before));
    expect(after).toEqual(before);
    const files = `SELECT id, md5(data) AS digest, size_bytes FROM certificate_files ORDER BY id`;
    const certificates = await query<{ digest: string }>(source.url, files);
    expect(certificates.length).toBeGreaterThan(0);
    expect(await query(restored.databaseUrl, files)).toEqual(certificates);
  });

  it('refuses to overwrite a database that is not empty unless forced, and leaves it as it was', async () => {
    const other = await createTestDatabase({ seed: false }); // migrated: it has tables
    try {
      const before = await fingerprint(other.url);
      const refused = await restoreBackup({ file, databaseUrl: other.url, pgBin: PG_BIN }).catch((e: unknown) => e);
      expect(refused).toBeInstanceOf(RestoreRefused);
      expect((refused as Error).message).toMatch(/is not empty.*--new.*--force/);
      expect(await fingerprint(other.url)).toEqual(before);

      await other.db.destroy(); // --force replaces everything: nobody may be using it
      await restoreBackup({ file, databaseUrl: other.url, pgBin: PG_BIN, force: true });
      expect(await fingerprint(other.url)).toEqual(await fingerprint(source.url));
    } finally {
      await other.drop();
    }
  });

  it('refuses a new database name that exists already', async () => {
    const name = made[0];
    await expect(restoreBackup({ file, databaseUrl: source.url, pgBin: PG_BIN, newDatabase: name })).rejects.toThrow(/exists already/);
  });

  it('prunes the folder by the retention policy, leaving files that are not backups alone', async () => {
    const own = await mkdtemp(path.join(os.tmpdir(), 'nk-prune-'));
    try {
      const names = ['nestkeeper-20261201T023000Z.dump', 'nestkeeper-20261202T023000Z.dump', 'nestkeeper-20261203T023000Z.dump', 'notes.txt'];
      for (const n of names) await writeFile(path.join(own, n), 'x');
      const deleted = await pruneBackups(own, { daily: 2, weekly: 0 }, new Date('2026-12-03T12:00:00Z'));
      expect(deleted).toEqual(['nestkeeper-20261201T023000Z.dump']);
      expect((await readdir(own)).sort()).toEqual(names.slice(1).sort());
    } finally {
      await rm(own, { recursive: true, force: true });
    }
  });
});
