import { Router } from 'express';
import { chargePayload, customerPayload, handoverOverridePayload, quoteQuery, rateCardPayload, rentalPayload } from '../../shared/schemas/rentals';
import { endpoint, paging } from '../http/endpoint';
import { sendDocument } from '../http/send-file';
import type { CustomersService } from './customers.service';
import type { RateCardsService } from './rate-cards.service';
import type { RentalsService } from './rentals.service';

type RentalsServices = { customers: CustomersService; rateCards: RateCardsService; rentals: RentalsService };

/** Mounted at /api: customers, rate cards, quotes and rentals (the list of rentals by money state is billing's). */
export function rentalsRoutes({ customers, rateCards, rentals }: RentalsServices): Router {
  const router = Router();
  const at = '/api';
  endpoint(router, at, { method: 'get', path: '/customers', summary: 'Customers', access: 'customers.read', query: paging }, ({ actor, query }) =>
    customers.list(actor, query),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/customers', summary: 'Add a customer', access: 'customers.write', body: customerPayload, status: 201 },
    ({ actor, body }) => customers.save(actor, body),
  );
  endpoint(router, at, { method: 'get', path: '/customers/:id', summary: 'One customer', access: 'customers.read' }, ({ actor, params }) =>
    customers.get(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'put', path: '/customers/:id', summary: 'Change a customer', access: 'customers.write', body: customerPayload },
    ({ actor, params, body }) => customers.save(actor, body, params.id),
  );
  endpoint(router, at, { method: 'get', path: '/rate-cards', summary: 'Rental rates per asset type and per kit', access: 'reports.read' }, ({ actor }) =>
    rateCards.list(actor),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/rate-cards', summary: 'Add a rate card', access: 'rentals.write', body: rateCardPayload, status: 201 },
    ({ actor, body }) => rateCards.save(actor, body),
  );
  endpoint(
    router,
    at,
    { method: 'put', path: '/rate-cards/:id', summary: 'Change a rate card', access: 'rentals.write', body: rateCardPayload },
    ({ actor, params, body }) => rateCards.save(actor, body, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/quotes', summary: 'Price a rental: days, lines, tax, total, deposit', access: 'reports.read', query: quoteQuery },
    ({ actor, query }) => rateCards.quote(actor, query),
  );

  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/rentals',
      summary: 'Rent kit to a customer at quoted prices (a booking under the usual rules)',
      access: 'rentals.write',
      body: rentalPayload,
      status: 201,
    },
    ({ actor, body }) => rentals.create(actor, body),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/rentals/:id', summary: 'One rental with its deposit, charges and invoices', access: 'reports.read' },
    ({ actor, params }) => rentals.get(actor, params.id),
  );
  endpoint(
    router,
    at,
    {
      method: 'put',
      path: '/rentals/:id/charges/:incidentId',
      summary: 'Set the charge for a damaged or missing item',
      access: 'rentals.write',
      body: chargePayload,
    },
    ({ actor, params, body }) => rentals.setCharge(actor, params.id, params.incidentId, body.amountMinor),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/rentals/:id/handover-override',
      summary: 'Owner: let the kit go without the accepted agreement or the card authorization, with a reason',
      access: 'settings.manage',
      body: handoverOverridePayload,
    },
    ({ actor, params, body }) => rentals.overrideHandover(actor, params.id, body.reason),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/rentals/:id/agreement.pdf', summary: 'Rental agreement (PDF)', access: 'reports.read' },
    async ({ actor, params, res }) => {
      const { pdf, number } = await rentals.agreementPdf(actor, params.id);
      sendDocument(res, pdf, 'application/pdf', `agreement-${number}.pdf`, true);
    },
  );
  endpoint(
    router,
    at,
    {
      method: 'get',
      path: '/rentals/:id/certificate-pack.pdf',
      summary: 'Current calibration certificates of the rented items, one PDF',
      access: 'reports.read',
    },
    async ({ actor, params, res }) => {
      const { pdf, number } = await rentals.certificatePackPdf(actor, params.id);
      sendDocument(res, pdf, 'application/pdf', `certificates-${number}.pdf`, true);
    },
  );
  return router;
}
