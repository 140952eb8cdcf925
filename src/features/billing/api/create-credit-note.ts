import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvoiceView } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { invalidateRentalsAndBilling } from '../../../lib/rental-status';

/** Credits an invoice: `amountMinor` net of tax, or the whole invoice when left out. */
export function createCreditNote({ invoiceId, reason, amountMinor }: { invoiceId: string; reason: string; amountMinor?: number }): Promise<InvoiceView> {
  return apiClient.post<InvoiceView>(`/invoices/${encodeURIComponent(invoiceId)}/credit-note`, {
    reason,
    ...(amountMinor !== undefined ? { amountMinor } : {}),
  });
}

export function useCreateCreditNote() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createCreditNote, onSuccess: () => invalidateRentalsAndBilling(queryClient) });
}
