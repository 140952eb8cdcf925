import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { organizationSettingsPayload } from '../../shared/schemas/assets';
import { endpoint } from '../http/endpoint';
import { getSettings, updateSettings } from './settings.service';

export function settingsRoutes(db: DataSource): Router {
  const router = Router();
  const at = '/api/settings';
  endpoint(router, at, { method: 'get', path: '/', summary: "The firm's settings", access: 'signed-in' }, ({ actor }) => getSettings(db, actor));
  endpoint(
    router,
    at,
    { method: 'patch', path: '/', summary: 'Change the due-soon window or time zone', access: 'settings.manage', body: organizationSettingsPayload },
    ({ actor, body }) => updateSettings(db, actor, body),
  );
  return router;
}
