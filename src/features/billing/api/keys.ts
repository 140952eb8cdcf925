import type { InvoiceKind, RentalListView, RentalScope } from './types';

/** Customers, rate cards, quotes, rentals with their deposits, invoices and the billing reports. */
export const billingKeys = {
  all: ['billing'] as const,
  customers: () => [...billingKeys.all, 'customers'] as const,
  customer: (id: string) => [...billingKeys.customers(), 'one', id] as const,
  rateCards: () => [...billingKeys.all, 'rate-cards'] as const,
  quote: (scope: RentalScope) => [...billingKeys.all, 'quote', scope] as const,
  assetChoices: (filter: { q?: string; kitId?: string }) => [...billingKeys.all, 'asset-choices', filter] as const,
  rentals: () => [...billingKeys.all, 'rentals'] as const,
  rentalLists: () => [...billingKeys.rentals(), 'list'] as const,
  rentalList: (view: RentalListView, customerId?: string) => [...billingKeys.rentalLists(), view, { customerId }] as const,
  rental: (id: string) => [...billingKeys.rentals(), 'one', id] as const,
  invoices: () => [...billingKeys.all, 'invoices'] as const,
  invoiceList: (kind: InvoiceKind | 'all', customerId?: string) => [...billingKeys.invoices(), 'list', kind, { customerId }] as const,
  reports: () => [...billingKeys.all, 'reports'] as const,
  revenue: (range: { from: string; to: string }) => [...billingKeys.reports(), 'revenue', range] as const,
  utilisation: (range: { from: string; to: string }) => [...billingKeys.reports(), 'utilisation', range] as const,
};
