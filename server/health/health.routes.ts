import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { DatabaseWatch } from '../db/reachability';
import { endpoint } from '../http/endpoint';
import { AppError } from '../http/errors';
import { openApiDocument } from '../http/openapi';

/** Which of the migrations this build knows are not applied to the database. */
async function pendingMigrations(db: DataSource): Promise<string[]> {
  const rows: { name: string }[] = await db.query('SELECT name FROM schema_migrations');
  const applied = new Set(rows.map((r) => r.name));
  return db.migrations.map((m) => m.name ?? m.constructor.name).filter((name) => !applied.has(name));
}

/**
 * Liveness (`/health`: the process serves; a restart would not help while only the database is away) and readiness
 * (`/ready`: the database answers and its schema is this build's, so a load balancer may send work here).
 */
export function healthRoutes(db: DataSource, watch: DatabaseWatch): Router {
  const router = Router();
  endpoint(router, '/api', { method: 'get', path: '/health', summary: 'Liveness: the server process answers', access: 'public' }, () => ({ status: 'ok' }));
  endpoint(
    router,
    '/api',
    { method: 'get', path: '/ready', summary: 'Readiness: the database answers and its migrations are current', access: 'public' },
    async () => {
      if (!(await watch.check())) throw new AppError(503, 'unavailable', 'Nestkeeper cannot reach its database just now.', { database: 'unreachable' });
      const pending = await pendingMigrations(db);
      if (pending.length) throw new AppError(503, 'not_ready', `The database lacks ${pending.length} migration(s) of this version.`, { pending });
      return { status: 'ready', database: 'reachable', migrations: 'current' };
    },
  );
  endpoint(router, '/api', { method: 'get', path: '/openapi.json', summary: 'This description', access: 'public' }, () => openApiDocument());
  return router;
}
