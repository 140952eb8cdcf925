import { Router } from 'express';
import { customerPayload, quoteQuery, rateCardPayload } from '../../shared/schemas/rentals';
import { endpoint, paging } from '../http/endpoint';
import type { RentalsService } from './rentals.service';

/** Mounted at /api: customers, rate cards and quotes. */
export function rentalsRoutes(rentals: RentalsService): Router {
  const router = Router();
  const at = '/api';
  endpoint(router, at, { method: 'get', path: '/customers', summary: 'Customers', access: 'bookings.read', query: paging }, ({ actor, query }) => rentals.listCustomers(actor, query));
  endpoint(router, at, { method: 'post', path: '/customers', summary: 'Add a customer', access: 'customers.write', body: customerPayload, status: 201 }, ({ actor, body }) => rentals.saveCustomer(actor, body));
  endpoint(router, at, { method: 'get', path: '/customers/:id', summary: 'One customer', access: 'bookings.read' }, ({ actor, params }) => rentals.getCustomer(actor, params.id));
  endpoint(router, at, { method: 'put', path: '/customers/:id', summary: 'Change a customer', access: 'customers.write', body: customerPayload }, ({ actor, params, body }) => rentals.saveCustomer(actor, body, params.id));
  endpoint(router, at, { method: 'get', path: '/rate-cards', summary: 'Rental rates per asset type and per kit', access: 'bookings.read' }, ({ actor }) => rentals.listRateCards(actor));
  endpoint(router, at, { method: 'post', path: '/rate-cards', summary: 'Add a rate card', access: 'rentals.write', body: rateCardPayload, status: 201 }, ({ actor, body }) => rentals.saveRateCard(actor, body));
  endpoint(router, at, { method: 'put', path: '/rate-cards/:id', summary: 'Change a rate card', access: 'rentals.write', body: rateCardPayload }, ({ actor, params, body }) => rentals.saveRateCard(actor, body, params.id));
  endpoint(router, at, { method: 'get', path: '/quotes', summary: 'Price a rental: days, lines, tax, total, deposit', access: 'bookings.read', query: quoteQuery }, ({ actor, query }) => rentals.quote(actor, query));
  return router;
}
