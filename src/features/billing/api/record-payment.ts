import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { refreshBilling } from './rental-cache';
import type { InvoiceView } from './types';

/** Money received against an invoice (a bank transfer, say). */
export function recordPayment({ invoiceId, ...body }: { invoiceId: string; amountMinor: number; receivedOn: string; reference: string }): Promise<InvoiceView> {
  return apiClient.post<InvoiceView>(`/invoices/${encodeURIComponent(invoiceId)}/payments`, body);
}

export function useRecordPayment() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: recordPayment, onSuccess: () => refreshBilling(queryClient) });
}
