import { Router } from 'express';
import { checkListQuery, checkPayload } from '../../shared/schemas/checks';
import { endpoint } from '../http/endpoint';
import type { ChecksService } from './checks.service';

export function checksRoutes(checks: ChecksService): Router {
  const router = Router();
  const at = '/api';
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/checks',
      summary: 'Record a field check (tip validation, two-face, length check); a failure holds the item. A resent id answers the stored check (200)',
      access: 'checks.record',
      body: checkPayload,
      status: 201,
    },
    async ({ actor, body, res }) => {
      const { check, replayed } = await checks.record(actor, body);
      res.status(replayed ? 200 : 201).json(check);
    },
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/checks', summary: 'Field checks, newest first', access: 'fleet.read', query: checkListQuery },
    ({ actor, query }) => checks.list(actor, query),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/checks/to-do', summary: 'Tip positions without a passing validation in the kit I carry now or next', access: 'fleet.read' },
    ({ actor }) => checks.toDo(actor),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/checks/forecasts',
      summary: 'Tip positions forecast to reach their limit within the due-soon window (advice: holds nothing)',
      access: 'fleet.read',
    },
    ({ actor }) => checks.forecastsSoon(actor),
  );
  endpoint(router, at, { method: 'get', path: '/checks/:id', summary: 'One field check with inputs and results', access: 'fleet.read' }, ({ actor, params }) =>
    checks.get(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/assets/:id/tip-validation', summary: "A tip's validation state per mounting position", access: 'fleet.read' },
    ({ actor, params }) => checks.tipStatus(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/assets/:id/tip-forecast', summary: "A tip's drift forecast per mounting position (advice: holds nothing)", access: 'fleet.read' },
    ({ actor, params }) => checks.tipForecast(actor, params.id),
  );
  return router;
}
