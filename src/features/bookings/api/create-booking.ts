import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys } from './keys';
import type { Booking, BookingInput } from './types';

export function createBooking(input: BookingInput): Promise<Booking> {
  return apiClient.post<Booking>('/bookings', input);
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
