import 'reflect-metadata';
import pg from 'pg';
import { openDataSource } from '../../server/data-source';

export const TEMPLATE_DB = 'nk_template';

/** Migrate one template database; each test file clones it (fast, isolated). Without
 * TEST_PG_URL (`npm test -- shared`: pure tests only) there is nothing to prepare. */
export default async function setup() {
  const server = process.env.TEST_PG_URL;
  if (!server) return;
  const admin = new pg.Client({ connectionString: `${server}/postgres` });
  await admin.connect();
  await admin.query(`DROP DATABASE IF EXISTS ${TEMPLATE_DB}`);
  await admin.query(`CREATE DATABASE ${TEMPLATE_DB}`);
  await admin.end();
  const db = await openDataSource(`${server}/${TEMPLATE_DB}`, 1).initialize();
  await db.runMigrations({ transaction: 'each' });
  await db.destroy();
}
