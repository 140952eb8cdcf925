import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { endpoint } from '../http/endpoint';
import { AppError } from '../http/errors';
import { openApiDocument } from '../http/openapi';

export function healthRoutes(db: DataSource): Router {
  const router = Router();
  endpoint(router, '/api', { method: 'get', path: '/health', summary: 'Answers once the database does', access: 'public' }, async () => {
    try {
      await db.query('SELECT 1');
    } catch {
      throw new AppError(503, 'unavailable', 'The database is not answering yet.');
    }
    return { status: 'ok' };
  });
  endpoint(router, '/api', { method: 'get', path: '/openapi.json', summary: 'This description', access: 'public' }, () => openApiDocument());
  return router;
}
