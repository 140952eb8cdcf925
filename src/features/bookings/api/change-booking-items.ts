import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys } from './keys';
import type { BookingView } from '../../../../shared/bookings/views';

export interface ChangeItemsInput {
  id: string;
  add: string[];
  remove: string[];
}

/** POST /api/bookings/:id/items — add, remove or swap items of a reserved booking (same refusals and alternatives as booking). */
export function changeBookingItems({ id, ...change }: ChangeItemsInput): Promise<BookingView> {
  return apiClient.post<BookingView>(`/bookings/${encodeURIComponent(id)}/items`, change);
}

export function useChangeBookingItems() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeBookingItems,
    onSuccess: (booking) => {
      queryClient.setQueryData(bookingsKeys.one(booking.id), booking);
      return queryClient.invalidateQueries({ queryKey: bookingsKeys.all });
    },
  });
}
