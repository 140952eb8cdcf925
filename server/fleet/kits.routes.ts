import { Router } from 'express';
import { kitPayload, updateKitPayload } from '../../shared/schemas/assets';
import { endpoint, paging } from '../http/endpoint';
import { sendDocument } from '../http/send-file';
import type { FleetDocumentsService } from './fleet-documents.service';
import type { KitsService } from './kits.service';

export function kitsRoutes(kits: KitsService, documents: FleetDocumentsService): Router {
  const router = Router();
  const at = '/api/kits';
  endpoint(router, at, { method: 'get', path: '/', summary: 'Kits with readiness', access: 'fleet.read', query: paging }, ({ actor, query }) =>
    kits.list(actor, query),
  );
  endpoint(router, at, { method: 'post', path: '/', summary: 'Create a kit', access: 'fleet.write', body: kitPayload, status: 201 }, ({ actor, body }) =>
    kits.create(actor, body),
  );
  endpoint(router, at, { method: 'get', path: '/:id', summary: 'A kit with its members (the packing list)', access: 'fleet.read' }, ({ actor, params }) =>
    kits.get(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'patch', path: '/:id', summary: 'Rename a kit or replace its members', access: 'fleet.write', body: updateKitPayload },
    ({ actor, params, body }) => kits.update(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/:id/labels.pdf', summary: "All members' labels on one page", access: 'fleet.read' },
    async ({ actor, params, res }) => sendDocument(res, await documents.kitLabels(actor, params.id), 'application/pdf', 'kit-labels.pdf', true),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/:id/shipping-sheet', summary: "The kit's batteries with watt-hours and shipping class", access: 'fleet.read' },
    ({ actor, params }) => documents.shippingSheet(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/:id/shipping-sheet.pdf', summary: 'Battery shipping sheet as PDF', access: 'fleet.read' },
    async ({ actor, params, res }) => sendDocument(res, await documents.shippingSheetPdf(actor, params.id), 'application/pdf', 'shipping-sheet.pdf', true),
  );
  return router;
}
