import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { refreshBilling } from './rental-cache';
import type { InvoiceView } from './types';

/** Issues the rental's invoice: only after return, once the deposit is settled (422 otherwise). */
export function issueInvoice(rentalId: string): Promise<InvoiceView> {
  return apiClient.post<InvoiceView>(`/rentals/${encodeURIComponent(rentalId)}/invoice`);
}

export function useIssueInvoice() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: issueInvoice, onSuccess: () => refreshBilling(queryClient) });
}
