import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvoiceView } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { invalidateRentalsAndBilling } from '../../../lib/rental-status';

/** Money received against an invoice (a bank transfer, say). */
export function recordPayment({ invoiceId, ...body }: { invoiceId: string; amountMinor: number; receivedOn: string; reference: string }): Promise<InvoiceView> {
  return apiClient.post<InvoiceView>(`/invoices/${encodeURIComponent(invoiceId)}/payments`, body);
}

export function useRecordPayment() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: recordPayment, onSuccess: () => invalidateRentalsAndBilling(queryClient) });
}
