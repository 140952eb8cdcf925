import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RentalView } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { invalidateRentalsAndBilling } from '../../../lib/rental-status';

/** Authorizes the deposit hold on a card (422 `card_declined`; 502 `payment_unavailable`). */
export function takeDeposit({ rentalId, paymentMethod }: { rentalId: string; paymentMethod: string }): Promise<RentalView> {
  return apiClient.post<RentalView>(`/rentals/${encodeURIComponent(rentalId)}/deposit`, { paymentMethod });
}

export function useTakeDeposit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: takeDeposit,
    // The rental's page, its lists, the invoices and reports show the deposit; a refused call may still have changed it (a declined card is kept on record).
    onSettled: () => invalidateRentalsAndBilling(queryClient),
  });
}
