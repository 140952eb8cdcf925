import { Router } from 'express';
import { endpoint } from '../http/endpoint';
import type { FieldService } from './field.service';

export function fieldRoutes(field: FieldService): Router {
  const router = Router();
  endpoint(
    router,
    '/api/field',
    {
      method: 'get',
      path: '/copy',
      summary: "The field copy for the signed-in person's phone: kit carried now and next with every item, tip validations, check rules",
      access: 'checks.record',
    },
    ({ actor, res }) => {
      // Personal and changing: a shared cache must never keep it; the phone keeps its own copy in IndexedDB.
      res.set('Cache-Control', 'private, no-store');
      return field.copy(actor);
    },
  );
  return router;
}
