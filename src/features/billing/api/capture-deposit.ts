import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RentalView } from '../../../../shared/billing/views';
import { apiClient } from '../../../lib/api-client';
import { invalidateRentalsAndBilling } from '../../../lib/rental-status';

/** Captures `amountMinor` from the hold and releases the rest; beyond the hold, the difference is charged to the saved card. */
export function captureDeposit({ rentalId, amountMinor, reason }: { rentalId: string; amountMinor: number; reason: string }): Promise<RentalView> {
  return apiClient.post<RentalView>(`/rentals/${encodeURIComponent(rentalId)}/deposit/capture`, { amountMinor, reason });
}

export function useCaptureDeposit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: captureDeposit,
    // The rental's page, its lists, the invoices and reports show the deposit; a refused call may still have changed it (a declined card is kept on record).
    onSettled: () => invalidateRentalsAndBilling(queryClient),
  });
}
