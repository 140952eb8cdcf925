import { Router } from 'express';
import { z } from 'zod';
import { incidentListQuery, incidentPayload, incidentUpdatePayload, MAX_INCIDENT_PHOTOS, MAX_PHOTO_BYTES } from '../../shared/schemas/incidents';
import { endpoint } from '../http/endpoint';
import type { IncidentsService } from './incidents.service';

const photoUpload = { files: 'photos', maxFiles: MAX_INCIDENT_PHOTOS, maxBytes: MAX_PHOTO_BYTES };
const photoQuery = z.object({ size: z.enum(['full', 'thumbnail']).default('full') });

export function incidentsRoutes(incidents: IncidentsService): Router {
  const router = Router();
  const at = '/api/incidents';
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/',
      summary: 'Report damage or loss (multipart, photos[]); the item is held at once. A resent id answers the stored report (200)',
      access: 'incidents.report',
      body: incidentPayload,
      upload: photoUpload,
      status: 201,
    },
    async ({ actor, body, files, res }) => {
      const { incident, replayed } = await incidents.report(actor, body, files);
      res.status(replayed ? 200 : 201).json(incident);
    },
  );
  endpoint(router, at, { method: 'get', path: '/', summary: 'Incidents, newest first', access: 'fleet.read', query: incidentListQuery }, ({ actor, query }) =>
    incidents.list(actor, query),
  );
  endpoint(router, at, { method: 'get', path: '/:id', summary: 'One incident with its photos', access: 'fleet.read' }, ({ actor, params }) =>
    incidents.get(actor, params.id),
  );
  endpoint(
    router,
    at,
    {
      method: 'patch',
      path: '/:id',
      summary: 'Move an incident on (reviewing, resolved) with a resolution and charge',
      access: 'incidents.review',
      body: incidentUpdatePayload,
    },
    ({ actor, params, body }) => incidents.update(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/:id/photos/:photoId', summary: 'A photo of an incident (organization only)', access: 'fleet.read', query: photoQuery },
    async ({ actor, params, query, res }) => {
      const photo = await incidents.photo(actor, params.id, params.photoId, query.size === 'thumbnail');
      res.status(200).type(photo.contentType).set('Cache-Control', 'private, max-age=3600').set('X-Content-Type-Options', 'nosniff').send(photo.data);
    },
  );
  return router;
}
