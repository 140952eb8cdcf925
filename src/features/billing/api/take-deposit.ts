import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { reloadRental, storeRental } from './rental-cache';
import type { RentalView } from './types';

/** Authorizes the deposit hold on a card (422 `card_declined`; 502 `payment_unavailable`). */
export function takeDeposit({ rentalId, paymentMethod }: { rentalId: string; paymentMethod: string }): Promise<RentalView> {
  return apiClient.post<RentalView>(`/rentals/${encodeURIComponent(rentalId)}/deposit`, { paymentMethod });
}

export function useTakeDeposit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: takeDeposit,
    onSuccess: (rental) => storeRental(queryClient, rental),
    onError: (_error, { rentalId }) => reloadRental(queryClient, rentalId),
  });
}
