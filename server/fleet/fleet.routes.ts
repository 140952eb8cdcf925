import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { assetListQuery, createAssetPayload, retireAssetPayload, updateAssetPayload } from '../../shared/schemas/assets';
import { text } from '../../shared/schemas/common';
import { endpoint } from '../http/endpoint';
import { sendDocument } from '../http/send-file';
import { importTemplateCsv } from './asset-csv';
import { importAssetsCsv } from './asset-import.service';
import type { AssetsService } from './assets.service';
import type { FleetDocumentsService } from './fleet-documents.service';

const importQuery = z.object({ mode: z.enum(['preview', 'commit']).default('preview') });
const lookupQuery = z.object({ code: text(500).min(1, 'give an asset tag, RFID tag or label code') });
const csvUpload = { text: ['text/csv', 'text/plain', 'application/csv'], maxBytes: 25 * 1024 * 1024 };
const exportQuery = assetListQuery.omit({ limit: true, offset: true });

export function fleetRoutes(db: DataSource, assets: AssetsService, documents: FleetDocumentsService): Router {
  const router = Router();
  const at = '/api/assets';
  const read = 'fleet.read' as const;
  const write = 'fleet.write' as const;

  // Fixed paths before `/:id`.
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/suggestions',
      summary: 'Near misses for a search that found nothing (trigram similarity of tags, serials, RFID tags)',
      access: read,
      query: z.object({ q: text(500).min(1, 'give what was searched for') }),
    },
    ({ actor, query }) => assets.suggest(actor, query.q),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/lookup', summary: 'Find an asset by asset tag, RFID tag or QR label payload', access: read, query: lookupQuery },
    ({ actor, query }) => assets.lookup(actor, query.code),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/export.csv', summary: 'The filtered list as CSV (RFC 4180)', access: read, query: exportQuery },
    async ({ actor, query, res }) => sendDocument(res, await documents.exportCsv(actor, query), 'text/csv; charset=utf-8', 'nestkeeper-fleet.csv'),
  );
  endpoint(router, at, { method: 'get', path: '/import/template.csv', summary: 'An example import file with every column', access: read }, ({ res }) =>
    sendDocument(res, importTemplateCsv(), 'text/csv; charset=utf-8', 'nestkeeper-import-template.csv'),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/import',
      summary: 'Import assets from CSV: mode=preview checks, mode=commit writes all or nothing',
      access: write,
      query: importQuery,
      upload: csvUpload,
    },
    ({ actor, query, req }) => importAssetsCsv(db, actor, req.body as string, query.mode),
  );

  endpoint(
    router,
    at,
    { method: 'get', path: '/', summary: 'List assets with search, filters and sort', access: read, query: assetListQuery },
    ({ actor, query }) => assets.list(actor, query),
  );
  endpoint(router, at, { method: 'post', path: '/', summary: 'Register an asset', access: write, body: createAssetPayload, status: 201 }, ({ actor, body }) =>
    assets.create(actor, body),
  );
  endpoint(router, at, { method: 'get', path: '/:id', summary: 'One asset', access: read }, ({ actor, params }) => assets.get(actor, params.id));
  endpoint(
    router,
    at,
    { method: 'patch', path: '/:id', summary: 'Change an asset (not its type)', access: write, body: updateAssetPayload },
    ({ actor, params, body }) => assets.update(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/:id/retire', summary: 'Take an asset out of service for good', access: write, body: retireAssetPayload },
    ({ actor, params, body }) => assets.retire(actor, params.id, body.reason),
  );
  endpoint(router, at, { method: 'get', path: '/:id/history', summary: 'Audit trail and chain of custody', access: read }, ({ actor, params }) =>
    assets.history(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/:id/label.pdf', summary: 'Printable label with QR code and calibration due date', access: read },
    async ({ actor, params, res }) => sendDocument(res, await documents.label(actor, params.id), 'application/pdf', 'label.pdf', true),
  );
  return router;
}
