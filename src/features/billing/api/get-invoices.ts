import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, apiUrl } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { InvoiceKind, InvoiceSummary, Page } from './types';

export function getInvoices(kind: InvoiceKind | 'all', signal?: AbortSignal): Promise<Page<InvoiceSummary>> {
  return apiClient.get<Page<InvoiceSummary>>('/invoices', { query: { kind: kind === 'all' ? undefined : kind, limit: 500, offset: 0 }, signal });
}

export const invoicesQueryOptions = (kind: InvoiceKind | 'all') =>
  queryOptions({ queryKey: billingKeys.invoiceList(kind), queryFn: ({ signal }) => getInvoices(kind, signal) });

export function useInvoices(kind: InvoiceKind | 'all') {
  return useQuery(invoicesQueryOptions(kind));
}

/** Every invoice and credit note as CSV, and one document as PDF. */
export const invoicesCsvUrl = () => apiUrl('/invoices/export.csv');
export const invoiceDocumentUrl = (id: string) => apiUrl(`/invoices/${encodeURIComponent(id)}/document.pdf`);
