import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RentalView } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { invalidateRentalsAndBilling } from '../../../lib/rental-status';

/** Releases the whole hold: nothing is captured. */
export function releaseDeposit(rentalId: string): Promise<RentalView> {
  return apiClient.post<RentalView>(`/rentals/${encodeURIComponent(rentalId)}/deposit/release`);
}

export function useReleaseDeposit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: releaseDeposit,
    // The rental's page, its lists, the invoices and reports show the deposit; a refused call may still have changed it (a declined card is kept on record).
    onSettled: () => invalidateRentalsAndBilling(queryClient),
  });
}
