import { Router } from 'express';
import { agreementAcceptancePayload } from '../../shared/schemas/rentals';
import { endpoint } from '../http/endpoint';
import { sendDocument } from '../http/send-file';
import type { RenterService } from './renter.service';

/** Mounted at /api/renter: the renter's own page, opened by the secret in their link (no sign-in). */
export function renterRoutes(renter: RenterService): Router {
  const router = Router();
  const at = '/api/renter';
  endpoint(
    router,
    at,
    { method: 'get', path: '/:token', summary: 'The renter’s page: rental, papers, agreement, deposit step', access: 'public' },
    ({ params, res }) => {
      res.set('Cache-Control', 'no-store');
      return renter.view(params.token);
    },
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/:token/agreement', summary: 'The renter accepts the rental agreement', access: 'public', body: agreementAcceptancePayload },
    ({ params, body, req }) =>
      renter.accept(params.token, body, { ip: req.ip ?? req.socket.remoteAddress ?? 'unknown', userAgent: req.get('user-agent') ?? null }),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/:token/agreement.pdf', summary: 'The rental agreement the renter accepts (PDF)', access: 'public' },
    async ({ params, res }) => {
      const { pdf, number } = await renter.agreementPdf(params.token);
      sendDocument(res, pdf, 'application/pdf', `agreement-${number}.pdf`, true);
    },
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/:token/certificate-pack.pdf', summary: 'Calibration certificates of the rented items (PDF)', access: 'public' },
    async ({ params, res }) => {
      const { pdf, number } = await renter.certificatePackPdf(params.token);
      sendDocument(res, pdf, 'application/pdf', `certificates-${number}.pdf`, true);
    },
  );
  return router;
}
