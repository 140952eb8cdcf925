import { Router } from 'express';
import { auditPackQuery, recordPeriodQuery } from '../../shared/schemas/records';
import { endpoint } from '../http/endpoint';
import { sendDocument } from '../http/send-file';
import type { RecordsService } from './records.service';

/** Mounted under /api: the equipment record hangs off its asset, the audit pack off the firm. */
export function recordsRoutes(records: RecordsService): Router {
  const router = Router();
  const at = '/api';
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/assets/:id/record',
      summary: 'Equipment record (ISO/IEC 17025:2017 §6.4.13), optionally for a period',
      access: 'fleet.read',
      query: recordPeriodQuery,
    },
    ({ actor, params, query }) => records.record(actor, params.id, query),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/assets/:id/record.pdf', summary: 'Equipment record as PDF, certificates annexed', access: 'fleet.read', query: recordPeriodQuery },
    async ({ actor, params, query, res }) => {
      const { pdf, assetTag } = await records.recordPdf(actor, params.id, query);
      sendDocument(res, pdf, 'application/pdf', `equipment-record-${assetTag}.pdf`, true);
    },
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/audit-pack/preview', summary: 'What an audit pack for these choices holds, counted', access: 'audit.pack', query: auditPackQuery },
    ({ actor, query }) => records.preview(actor, query),
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/audit-pack.zip',
      summary: 'The audit pack for a period and a set of items (ZIP, streamed)',
      access: 'audit.pack',
      query: auditPackQuery,
    },
    async ({ actor, query, res }) => {
      const pack = await records.prepareAuditPack(actor, query);
      res
        .status(200)
        .type('application/zip')
        .set('Content-Disposition', `attachment; filename="audit-pack-${query.from}-to-${query.to}.zip"`)
        .set('Cache-Control', 'no-store')
        .set('X-Pack-Items', String(pack.items));
      try {
        await pack.write(res);
      } catch (err) {
        // Headers are gone: cut the download so it cannot pass for a complete pack.
        res.destroy(err instanceof Error ? err : undefined);
      }
    },
  );
  return router;
}
