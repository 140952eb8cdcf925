import 'reflect-metadata';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { DataSource } from 'typeorm';
import { entities } from './entities';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** The schema comes only from migrations/ (never synchronize). */
export function createDataSource(url: string, poolSize = 10): DataSource {
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
    extra: { max: poolSize, connectionTimeoutMillis: 10_000 },
  });
}

/** For the TypeORM CLI (`npm run migration:generate`). */
export default createDataSource(process.env.DATABASE_URL ?? 'postgres://localhost/nestkeeper');
