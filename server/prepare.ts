import 'reflect-metadata';
import { readConfig } from './config';
import { openDataSource } from './data-source';
import { seedDemoIfEmpty } from './seed/seed-demo';

/** `npm start` step: apply pending migrations, then seed the demo into an empty database. */
async function prepare() {
  const config = readConfig();
  const db = await openDataSource(config.DATABASE_URL, 2).initialize();
  try {
    const applied = await db.runMigrations({ transaction: 'each' });
    console.log(applied.length ? `Applied ${applied.length} migration(s): ${applied.map((m) => m.name).join(', ')}` : 'Database schema is up to date.');
    if (await seedDemoIfEmpty(db, config.BCRYPT_COST)) console.log('Seeded the demo firms.');
  } finally {
    await db.destroy();
  }
}

prepare().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
