import { Router } from 'express';
import { holdPayload, releasePayload } from '../../shared/schemas/incidents';
import { endpoint } from '../http/endpoint';
import type { HoldsService } from './holds.service';

/** Mounted under /api/assets: holds belong to an asset. */
export function holdsRoutes(holds: HoldsService): Router {
  const router = Router();
  const at = '/api/assets';
  endpoint(
    router,
    at,
    { method: 'post', path: '/:id/hold', summary: 'Take an item out of service by hand', access: 'holds.release', body: holdPayload, status: 201 },
    ({ actor, params, body }) => holds.hold(actor, params.id, body.summary),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/:id/release',
      summary: 'Release a held item on evidence recorded since the hold began',
      access: 'holds.release',
      body: releasePayload,
    },
    ({ actor, params, body }) => holds.release(actor, params.id, body.note),
  );
  endpoint(router, at, { method: 'get', path: '/:id/holds', summary: "An item's holds, newest first", access: 'fleet.read' }, ({ actor, params }) =>
    holds.current(actor, params.id),
  );
  return router;
}
