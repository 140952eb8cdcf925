import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateBookingBoard } from '../../../lib/asset-status';
import type { RentalView } from '../../../../shared/billing/views';
import type { RentalScope } from './keys';
import { storeRental } from './rental-cache';

export type RentalInput = RentalScope & { customerId: string; note?: string };

/** Books the kit for the customer at the quoted price (409 `conflict`, 422 `booking_blocked` with alternatives). */
export function createRental(input: RentalInput): Promise<RentalView> {
  return apiClient.post<RentalView>('/rentals', input);
}

export function useCreateRental() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createRental,
    // The rental reserves a booking: the booking board changes too.
    onSuccess: (rental) => Promise.all([storeRental(queryClient, rental), invalidateBookingBoard(queryClient)]),
  });
}
