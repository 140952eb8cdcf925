import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvoiceSummary } from '../../../../shared/billing/views';
import type { Page } from '../../../../shared/lists/page';
import { apiClient, apiUrl } from '../../../lib/api-client';
import { billingKeys, type InvoiceKind } from './keys';

/** Without a customer, every customer's. */
export function getInvoices(kind: InvoiceKind | 'all', customerId?: string, signal?: AbortSignal): Promise<Page<InvoiceSummary>> {
  return apiClient.get<Page<InvoiceSummary>>('/invoices', { query: { kind: kind === 'all' ? undefined : kind, customerId, limit: 500, offset: 0 }, signal });
}

export const invoicesQueryOptions = (kind: InvoiceKind | 'all', customerId?: string) =>
  queryOptions({ queryKey: billingKeys.invoiceList(kind, customerId), queryFn: ({ signal }) => getInvoices(kind, customerId, signal) });

export function useInvoices(kind: InvoiceKind | 'all', customerId?: string) {
  return useQuery(invoicesQueryOptions(kind, customerId));
}

/** Every invoice and credit note as CSV, one document as PDF, and a rental's invoice as PDF. */
export const invoicesCsvUrl = () => apiUrl('/invoices/export.csv');
export const invoiceDocumentUrl = (id: string) => apiUrl(`/invoices/${encodeURIComponent(id)}/document.pdf`);
export const rentalInvoiceUrl = (rentalId: string) => apiUrl(`/rentals/${encodeURIComponent(rentalId)}/invoice.pdf`);
