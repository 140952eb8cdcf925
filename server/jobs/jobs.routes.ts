import { Router } from 'express';
import { endpoint } from '../http/endpoint';
import type { JobsService } from './jobs.service';

export function jobsRoutes(jobs: JobsService): Router {
  const router = Router();
  const at = '/api/admin/jobs';
  endpoint(router, at, { method: 'get', path: '/', summary: 'Scheduled jobs and their last runs', access: 'jobs.run' }, ({ actor }) => jobs.list(actor.organizationId));
  endpoint(router, at, { method: 'post', path: '/:name/run', summary: 'Run a scheduled job now for your firm and return its summary', access: 'jobs.run' }, async ({ params, actor }) => ({
    run: await jobs.run(params.name, 'manual', null, actor.organizationId),
  }));
  return router;
}
