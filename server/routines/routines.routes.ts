import { Router } from 'express';
import { endpoint } from '../http/endpoint';
import type { RoutinesService } from './routines.service';

export const ROUTINES_PATH = '/api/admin/routines';
/** The paths API.md first published (when routines were "scheduled jobs"), kept answering the same. */
export const OLD_JOBS_PATH = '/api/admin/jobs';

/** The owner's list of routines and "run now", mounted at `at` (ROUTINES_PATH, or the old alias). */
export function routinesRoutes(routines: RoutinesService, at: string = ROUTINES_PATH): Router {
  const router = Router();
  const alias = at === ROUTINES_PATH ? '' : ` (same as ${ROUTINES_PATH}; kept for existing callers)`;
  endpoint(router, at, { method: 'get', path: '/', summary: `Routines and their last runs${alias}`, access: 'routines.run' }, ({ actor }) =>
    routines.list(actor.organizationId),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/:name/run', summary: `Run a routine now for your firm and return its summary${alias}`, access: 'routines.run' },
    async ({ params, actor }) => ({
      run: await routines.run(params.name, 'manual', null, actor.organizationId),
    }),
  );
  return router;
}
