import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { reloadRental, storeRental } from './rental-cache';
import type { RentalView } from './types';

/** Captures `amountMinor` from the hold and releases the rest; beyond the hold, the difference is charged to the saved card. */
export function captureDeposit({ rentalId, amountMinor, reason }: { rentalId: string; amountMinor: number; reason: string }): Promise<RentalView> {
  return apiClient.post<RentalView>(`/rentals/${encodeURIComponent(rentalId)}/deposit/capture`, { amountMinor, reason });
}

export function useCaptureDeposit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: captureDeposit,
    onSuccess: (rental) => storeRental(queryClient, rental),
    onError: (_error, { rentalId }) => reloadRental(queryClient, rentalId),
  });
}
