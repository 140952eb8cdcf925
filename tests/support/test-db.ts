import 'reflect-metadata';
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import type { DataSource } from 'typeorm';
import { openDataSource } from '../../server/data-source';
import { seedDemoIfEmpty } from '../../server/seed/seed-demo';
import { waitUntil } from './eventually';

/** A fresh, migrated database cloned from the template, optionally with the demo seed. */
export async function createTestDatabase(opts: { seed?: boolean } = {}): Promise<{ db: DataSource; url: string; drop(): Promise<void> }> {
  const server = process.env.TEST_PG_URL;
  if (!server) throw new Error('TEST_PG_URL is not set: run the suite with `npm test`, which starts a throwaway PostgreSQL.');
  const name = `nk_${randomBytes(6).toString('hex')}`;
  const admin = new pg.Client({ connectionString: `${server}/postgres` });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${name} TEMPLATE nk_template`);
  await admin.end();
  const url = `${server}/${name}`;
  const db = await openDataSource(url, 5).initialize();
  if (opts.seed) await seedDemoIfEmpty(db, 12);
  // TypeORM's destroy() releases connections mid-query: let work a response left running (the
  // sign-in limiter's bookkeeping after a successful sign-in) finish first, however slow the machine.
  const busy = () => (db.driver as unknown as { connectedQueryRunners: unknown[] }).connectedQueryRunners.length > 0;
  return {
    db,
    url,
    async drop() {
      if (db.isInitialized) {
        await waitUntil('the last queries on the test database to finish', () => !busy());
        await db.destroy();
      }
      const c = new pg.Client({ connectionString: `${server}/postgres` });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await c.end();
    },
  };
}
