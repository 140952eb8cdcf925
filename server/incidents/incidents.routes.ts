import { Router } from 'express';
import { z } from 'zod';
import { incidentListQuery, incidentPayload, incidentUpdatePayload, MAX_INCIDENT_PHOTOS, MAX_PHOTO_BYTES } from '../../shared/schemas/incidents';
import { endpoint } from '../http/endpoint';
import { AppError } from '../http/errors';
import { parse } from '../http/parse';
import { memoryUpload } from '../http/upload';
import type { IncidentsService } from './incidents.service';

const upload = memoryUpload({
  field: 'photos',
  maxFiles: MAX_INCIDENT_PHOTOS,
  maxBytes: MAX_PHOTO_BYTES,
  eachFile: 'Each photo',
  wrongFiles: new AppError(413, 'too_large', `Attach at most ${MAX_INCIDENT_PHOTOS} photos, in the "photos" field.`),
});
const photoQuery = z.object({ size: z.enum(['full', 'thumbnail']).default('full') });

export function incidentsRoutes(incidents: IncidentsService): Router {
  const router = Router();
  const at = '/api/incidents';
  router.post('/', upload);
  endpoint(router, at, { method: 'post', path: '/', summary: 'Report damage or loss (multipart, photos[]); the item is held at once', access: 'incidents.report', status: 201 }, ({ actor, req }) => {
    const fields = parse(incidentPayload, req.body);
    return incidents.report(actor, fields, (req.files as Express.Multer.File[] | undefined) ?? []);
  });
  endpoint(router, at, { method: 'get', path: '/', summary: 'Incidents, newest first', access: 'fleet.read', query: incidentListQuery }, ({ actor, query }) => incidents.list(actor, query));
  endpoint(router, at, { method: 'get', path: '/:id', summary: 'One incident with its photos', access: 'fleet.read' }, ({ actor, params }) => incidents.get(actor, params.id));
  endpoint(router, at, { method: 'patch', path: '/:id', summary: 'Move an incident on (reviewing, resolved) with a resolution and charge', access: 'incidents.review', body: incidentUpdatePayload }, ({ actor, params, body }) =>
    incidents.update(actor, params.id, body),
  );
  endpoint(router, at, { method: 'get', path: '/:id/photos/:photoId', summary: 'A photo of an incident (organization only)', access: 'fleet.read', query: photoQuery }, async ({ actor, params, query, res }) => {
    const photo = await incidents.photo(actor, params.id, params.photoId, query.size === 'thumbnail');
    res.status(200).type(photo.contentType).set('Cache-Control', 'private, max-age=3600').set('X-Content-Type-Options', 'nosniff').send(photo.data);
  });
  return router;
}
