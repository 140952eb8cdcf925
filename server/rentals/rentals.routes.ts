import { Router } from 'express';
import { chargePayload, customerPayload, quoteQuery, rateCardPayload, rentalListQuery, rentalPayload } from '../../shared/schemas/rentals';
import { endpoint, paging } from '../http/endpoint';
import { sendDocument } from '../http/send-file';
import type { RentalRegisterService } from './rental-register.service';
import type { RentalsService } from './rentals.service';

/** Mounted at /api: customers, rate cards, quotes and rentals — the billing desk's and the owner's (the shop
 * manager reads customers, whose names its bookings show). A rental's papers need what the rental needs. */
export function rentalsRoutes(rentals: RentalsService, register: RentalRegisterService): Router {
  const router = Router();
  const at = '/api';
  endpoint(router, at, { method: 'get', path: '/customers', summary: 'Customers', access: 'customers.read', query: paging }, ({ actor, query }) => rentals.listCustomers(actor, query));
  endpoint(router, at, { method: 'post', path: '/customers', summary: 'Add a customer', access: 'customers.write', body: customerPayload, status: 201 }, ({ actor, body }) => rentals.saveCustomer(actor, body));
  endpoint(router, at, { method: 'get', path: '/customers/:id', summary: 'One customer', access: 'customers.read' }, ({ actor, params }) => rentals.getCustomer(actor, params.id));
  endpoint(router, at, { method: 'put', path: '/customers/:id', summary: 'Change a customer', access: 'customers.write', body: customerPayload }, ({ actor, params, body }) => rentals.saveCustomer(actor, body, params.id));
  endpoint(router, at, { method: 'get', path: '/rate-cards', summary: 'Rental rates per asset type and per kit', access: 'reports.read' }, ({ actor }) => rentals.listRateCards(actor));
  endpoint(router, at, { method: 'post', path: '/rate-cards', summary: 'Add a rate card', access: 'rentals.write', body: rateCardPayload, status: 201 }, ({ actor, body }) => rentals.saveRateCard(actor, body));
  endpoint(router, at, { method: 'put', path: '/rate-cards/:id', summary: 'Change a rate card', access: 'rentals.write', body: rateCardPayload }, ({ actor, params, body }) => rentals.saveRateCard(actor, body, params.id));
  endpoint(router, at, { method: 'get', path: '/quotes', summary: 'Price a rental: days, lines, tax, total, deposit', access: 'reports.read', query: quoteQuery }, ({ actor, query }) => rentals.quote(actor, query));

  endpoint(router, at, { method: 'post', path: '/rentals', summary: 'Rent kit to a customer at quoted prices (a booking under the usual rules)', access: 'rentals.write', body: rentalPayload, status: 201 }, ({ actor, body }) => register.create(actor, body));
  endpoint(router, at, { method: 'get', path: '/rentals', summary: 'Rentals: open, to settle at return, or all', access: 'reports.read', query: rentalListQuery }, ({ actor, query }) => register.list(actor, query));
  endpoint(router, at, { method: 'get', path: '/rentals/:id', summary: 'One rental with its deposit, charges and invoices', access: 'reports.read' }, ({ actor, params }) => register.get(actor, params.id));
  endpoint(router, at, { method: 'put', path: '/rentals/:id/charges/:incidentId', summary: 'Set the charge for a damaged or missing item', access: 'rentals.write', body: chargePayload }, ({ actor, params, body }) => register.setCharge(actor, params.id, params.incidentId, body.amountMinor));
  endpoint(router, at, { method: 'get', path: '/rentals/:id/agreement.pdf', summary: 'Rental agreement (PDF)', access: 'reports.read' }, async ({ actor, params, res }) => {
    const { pdf, number } = await register.agreementPdf(actor, params.id);
    sendDocument(res, pdf, 'application/pdf', `agreement-${number}.pdf`, true);
  });
  endpoint(router, at, { method: 'get', path: '/rentals/:id/certificate-pack.pdf', summary: 'Current calibration certificates of the rented items, one PDF', access: 'reports.read' }, async ({ actor, params, res }) => {
    const { pdf, number } = await register.certificatePackPdf(actor, params.id);
    sendDocument(res, pdf, 'application/pdf', `certificates-${number}.pdf`, true);
  });
  return router;
}
