import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys } from './keys';
import type { BookingView } from '../../../../shared/bookings/views';

export function cancelBooking(id: string): Promise<BookingView> {
  return apiClient.post<BookingView>(`/bookings/${encodeURIComponent(id)}/cancel`);
}

export function useCancelBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelBooking,
    onSuccess: (booking) => {
      queryClient.setQueryData(bookingsKeys.one(booking.id), booking);
      return queryClient.invalidateQueries({ queryKey: bookingsKeys.all });
    },
  });
}
