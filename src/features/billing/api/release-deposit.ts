import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { reloadRental, storeRental } from './rental-cache';
import type { RentalView } from './types';

/** Releases the whole hold: nothing is captured. */
export function releaseDeposit(rentalId: string): Promise<RentalView> {
  return apiClient.post<RentalView>(`/rentals/${encodeURIComponent(rentalId)}/deposit/release`);
}

export function useReleaseDeposit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: releaseDeposit,
    onSuccess: (rental) => storeRental(queryClient, rental),
    onError: (_error, rentalId) => reloadRental(queryClient, rentalId),
  });
}
