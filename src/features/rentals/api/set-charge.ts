import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { RentalView } from '../../../../shared/billing/views';
import { storeRental } from './rental-cache';

/** The repair or replacement charge (net of tax) for an item found damaged or missing at return. */
export function setCharge({ rentalId, incidentId, amountMinor }: { rentalId: string; incidentId: string; amountMinor: number }): Promise<RentalView> {
  return apiClient.put<RentalView>(`/rentals/${encodeURIComponent(rentalId)}/charges/${encodeURIComponent(incidentId)}`, { amountMinor });
}

export function useSetCharge() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: setCharge, onSuccess: (rental) => storeRental(queryClient, rental) });
}
