import 'reflect-metadata';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { DataSource, type DataSourceOptions } from 'typeorm';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** The schema comes only from migrations/ (never synchronize). The entities come from the
 * composition at the top (server/data-source.ts): db/ knows no component. */
export function createDataSource(url: string, entities: DataSourceOptions['entities'], poolSize = 10): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations: [path.join(root, 'migrations/*.ts')],
    migrationsTableName: 'schema_migrations',
    synchronize: false,
    uuidExtension: 'pgcrypto',
    // Tests provoke constraint violations on purpose; elsewhere a failed query is worth a log line.
    logging: process.env.NODE_ENV === 'test' ? false : ['error'],
    // A request waits at most this long for a connection; then it is answered 503 rather than left hanging.
    extra: {
      max: poolSize,
      connectionTimeoutMillis: 10_000,
      // Decided by `npm run bench:calibration` at 100,000 assets / 1,000,000 bookings (DEVELOPERS.md, performance):
      // the app's statements are short, and JIT compiling the larger ones (review CSV, audit pack) cost more than it saved;
      // parallel workers on a small machine take the cores other requests need (review CSV 965 → 605 ms with both off).
      options: '-c jit=off -c max_parallel_workers_per_gather=0',
    },
  });
}

/** node-postgres' pool behind a data source: connections open, idle, and requests waiting for one. */
export function poolUse(db: DataSource): { open: number; idle: number; waiting: number; max: number } {
  const pool = (db.driver as unknown as { master?: { totalCount: number; idleCount: number; waitingCount: number; options: { max: number } } }).master;
  return { open: pool?.totalCount ?? 0, idle: pool?.idleCount ?? 0, waiting: pool?.waitingCount ?? 0, max: pool?.options.max ?? 0 };
}
