import { Router } from 'express';
import {
  capturePayload,
  creditNotePayload,
  depositPayload,
  invoiceListQuery,
  invoicePaymentPayload,
  rentalListQuery,
  revenueQuery,
  utilisationQuery,
} from '../../shared/schemas/rentals';
import { endpoint } from '../http/endpoint';
import { sendDocument } from '../http/send-file';
import type { BillingReportsService } from './billing-reports.service';
import type { PaymentModeView } from '../../shared/billing/views';
import type { DepositRequestsService } from './deposit-requests.service';
import type { DepositsService } from './deposits.service';
import type { InvoicesService } from './invoices.service';

type BillingServices = {
  deposits: DepositsService;
  requests: DepositRequestsService;
  invoices: InvoicesService;
  reports: BillingReportsService;
  /** With a live key the clerk's test-card shortcut does not exist: the renter's hosted page is the only way. */
  payments: PaymentModeView;
};

/** Mounted at /api: the rentals' money (deposits as card authorizations, the list by what is left to settle), invoices and credit notes, billing reports. */
export function billingRoutes({ deposits, requests, invoices, reports, payments }: BillingServices): Router {
  const router = Router();
  const at = '/api';
  endpoint(
    router,
    at,
    { method: 'get', path: '/rentals', summary: 'Rentals: open, to settle at return, or all', access: 'reports.read', query: rentalListQuery },
    ({ actor, query }) => reports.rentals(actor, query),
  );
  endpoint(router, at, { method: 'get', path: '/billing/payment-mode', summary: 'Test or live payment keys', access: 'signed-in' }, () => payments);
  if (payments.mode === 'test')
    endpoint(
      router,
      at,
      {
        method: 'post',
        path: '/rentals/:id/deposit',
        summary: 'Test mode only: authorize the deposit with one of the provider’s test cards',
        access: 'deposits.manage',
        body: depositPayload,
      },
      ({ actor, params, body }) => deposits.authorize(actor, params.id, body.paymentMethod),
    );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/rentals/:id/deposit/request',
      summary: 'Send the renter a link to their page, where they accept the agreement and place the deposit on the provider’s hosted page',
      access: 'deposits.manage',
      status: 201,
    },
    ({ actor, params }) => requests.request(actor, params.id),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/rentals/:id/deposit/capture',
      summary: 'Take charges from the card authorization (the rest is released); above it, charge the card',
      access: 'deposits.manage',
      body: capturePayload,
    },
    ({ actor, params, body }) => deposits.capture(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/rentals/:id/deposit/release', summary: 'Release the whole card authorization', access: 'deposits.manage' },
    ({ actor, params }) => deposits.release(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/rentals/:id/invoice', summary: 'Issue the rental’s invoice', access: 'rentals.write', status: 201 },
    ({ actor, params }) => invoices.issue(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/rentals/:id/invoice.pdf', summary: 'The rental’s invoice (PDF)', access: 'reports.read' },
    async ({ actor, params, res }) => {
      const { pdf, number } = await invoices.rentalPdf(actor, params.id);
      sendDocument(res, pdf, 'application/pdf', `invoice-${number}.pdf`, true);
    },
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/invoices', summary: 'Invoices and credit notes', access: 'reports.read', query: invoiceListQuery },
    ({ actor, query }) => invoices.list(actor, query),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/invoices/export.csv', summary: 'Invoices and credit notes as CSV', access: 'reports.read' },
    async ({ actor, res }) => sendDocument(res, await invoices.csv(actor), 'text/csv; charset=utf-8', 'invoices.csv'),
  );
  endpoint(router, at, { method: 'get', path: '/invoices/:id', summary: 'One invoice or credit note', access: 'reports.read' }, ({ actor, params }) =>
    invoices.get(actor, params.id),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/invoices/:id/document.pdf', summary: 'Invoice or credit note (PDF)', access: 'reports.read' },
    async ({ actor, params, res }) => {
      const { pdf, number, kind } = await invoices.pdf(actor, params.id);
      sendDocument(res, pdf, 'application/pdf', `${kind === 'invoice' ? 'invoice' : 'credit-note'}-${number}.pdf`, true);
    },
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/invoices/:id/payments',
      summary: 'Record money received against an invoice',
      access: 'rentals.write',
      body: invoicePaymentPayload,
      status: 201,
    },
    ({ actor, params, body }) => invoices.recordPayment(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/invoices/:id/credit-note',
      summary: 'Correct an invoice with a credit note',
      access: 'rentals.write',
      body: creditNotePayload,
      status: 201,
    },
    ({ actor, params, body }) => invoices.creditNote(actor, params.id, body),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/billing/revenue', summary: 'Net invoiced per kit and month', access: 'reports.read', query: revenueQuery },
    ({ actor, query }) => reports.revenue(actor, query),
  );
  endpoint(
    router,
    at,
    { method: 'get', path: '/billing/utilisation', summary: 'Booked days over days in the period, per kit', access: 'reports.read', query: utilisationQuery },
    ({ actor, query }) => reports.utilisation(actor, query),
  );
  return router;
}
