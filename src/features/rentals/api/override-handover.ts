import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RentalView } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { storeRental } from './rental-cache';

/** The owner lets the kit go without the accepted agreement or the card authorization, saying why (audited). */
export function overrideHandover({ rentalId, reason }: { rentalId: string; reason: string }): Promise<RentalView> {
  return apiClient.post<RentalView>(`/rentals/${encodeURIComponent(rentalId)}/handover-override`, { reason });
}

export function useOverrideHandover() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: overrideHandover, onSuccess: (rental) => storeRental(queryClient, rental) });
}
