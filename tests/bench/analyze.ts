import pg from 'pg';

/** Fresh planner statistics after the bulk seed, as autovacuum would produce shortly after. */
const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
await client.connect();
await client.query('ANALYZE');
await client.end();
