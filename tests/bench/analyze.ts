import pg from 'pg';

/** Statistics and visibility maps after the bulk seed, as autovacuum would leave them shortly after. */
const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
await client.connect();
await client.query('VACUUM ANALYZE');
await client.end();
