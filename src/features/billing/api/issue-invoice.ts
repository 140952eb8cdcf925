import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvoiceView } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { invalidateRentalsAndBilling } from '../../../lib/rental-status';

/** Issues the rental's invoice: only after return, once the deposit is settled (422 otherwise). */
export function issueInvoice(rentalId: string): Promise<InvoiceView> {
  return apiClient.post<InvoiceView>(`/rentals/${encodeURIComponent(rentalId)}/invoice`);
}

export function useIssueInvoice() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: issueInvoice, onSuccess: () => invalidateRentalsAndBilling(queryClient) });
}
