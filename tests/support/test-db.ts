import 'reflect-metadata';
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import type { DataSource } from 'typeorm';
import { openDataSource } from '../../server/data-source';
import { seedDemoIfEmpty } from '../../server/seed/seed-demo';

/** A fresh, migrated database cloned from the template, optionally with the demo seed. */
export async function createTestDatabase(opts: { seed?: boolean } = {}): Promise<{ db: DataSource; url: string; drop(): Promise<void> }> {
  const server = process.env.TEST_PG_URL!;
  const name = `nk_${randomBytes(6).toString('hex')}`;
  const admin = new pg.Client({ connectionString: `${server}/postgres` });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${name} TEMPLATE nk_template`);
  await admin.end();
  const url = `${server}/${name}`;
  const db = await openDataSource(url, 5).initialize();
  if (opts.seed) await seedDemoIfEmpty(db, 12);
  return {
    db,
    url,
    async drop() {
      if (db.isInitialized) await db.destroy();
      const c = new pg.Client({ connectionString: `${server}/postgres` });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await c.end();
    },
  };
}
