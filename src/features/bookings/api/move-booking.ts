import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys } from './keys';
import type { BookingView } from '../../../../shared/bookings/views';

export interface MoveBookingInput {
  id: string;
  startsOn: string;
  endsOn: string;
  note?: string;
}

/** PATCH /api/bookings/:id — new dates for a reserved booking (same rules as booking). */
export function moveBooking({ id, ...dates }: MoveBookingInput): Promise<BookingView> {
  return apiClient.patch<BookingView>(`/bookings/${encodeURIComponent(id)}`, dates);
}

export function useMoveBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: moveBooking,
    onSuccess: (booking) => {
      queryClient.setQueryData(bookingsKeys.one(booking.id), booking);
      return queryClient.invalidateQueries({ queryKey: bookingsKeys.all });
    },
  });
}
