import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys } from './keys';
import type { BookingView } from '../../../../shared/bookings/views';
import type { BookingPayload } from '../../../../shared/schemas/bookings';

export function createBooking(input: BookingPayload): Promise<BookingView> {
  return apiClient.post<BookingView>('/bookings', input);
}

export function useCreateBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBooking,
    onSuccess: (booking) => {
      queryClient.setQueryData(bookingsKeys.one(booking.id), booking);
      return queryClient.invalidateQueries({ queryKey: bookingsKeys.all });
    },
  });
}
