import { billingQueryRoot } from '../../../lib/rental-status';

export type InvoiceKind = 'invoice' | 'credit_note';

/** Invoices and credit notes, and the billing reports. */
export const billingKeys = {
  all: billingQueryRoot,
  invoices: () => [...billingKeys.all, 'invoices'] as const,
  invoiceList: (kind: InvoiceKind | 'all', customerId?: string) => [...billingKeys.invoices(), 'list', kind, { customerId }] as const,
  paymentMode: () => [...billingKeys.all, 'payment-mode'] as const,
  reports: () => [...billingKeys.all, 'reports'] as const,
  revenue: (range: { from: string; to: string }) => [...billingKeys.reports(), 'revenue', range] as const,
  utilisation: (range: { from: string; to: string }) => [...billingKeys.reports(), 'utilisation', range] as const,
};
