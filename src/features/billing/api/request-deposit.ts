import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DepositRequestReply } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { invalidateRentalsAndBilling } from '../../../lib/rental-status';

/** Sends the renter a link to their page, where they accept the agreement and place the deposit on the provider's page (502 `payment_unavailable`: try again). */
export function requestDeposit(rentalId: string): Promise<DepositRequestReply> {
  return apiClient.post<DepositRequestReply>(`/rentals/${encodeURIComponent(rentalId)}/deposit/request`);
}

export function useRequestDeposit() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: requestDeposit, onSettled: () => invalidateRentalsAndBilling(queryClient) });
}
