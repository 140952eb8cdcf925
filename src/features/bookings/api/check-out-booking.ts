import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import { bookingsKeys } from './keys';
import type { Booking, HandoverInput } from './types';

/** POST /api/bookings/:id/checkout — the kit leaves against its packing list. */
export function checkOutBooking({ id, ...input }: HandoverInput & { id: string }): Promise<Booking> {
  return apiClient.post<Booking>(`/bookings/${encodeURIComponent(id)}/checkout`, input);
}

export function useCheckOutBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: checkOutBooking,
    onSuccess: (booking) => {
      queryClient.setQueryData(bookingsKeys.one(booking.id), booking);
      // The items are now out: fleet lists, kit readiness and holds change too.
      return Promise.all([queryClient.invalidateQueries({ queryKey: bookingsKeys.all }), invalidateAssetStatus(queryClient)]);
    },
  });
}
