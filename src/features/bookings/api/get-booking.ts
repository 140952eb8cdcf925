import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys } from './keys';
import type { BookingView } from '../../../../shared/bookings/views';

export function getBooking(id: string, signal?: AbortSignal): Promise<BookingView> {
  return apiClient.get<BookingView>(`/bookings/${encodeURIComponent(id)}`, { signal });
}

export const bookingQueryOptions = (id: string) =>
  queryOptions({
    queryKey: bookingsKeys.one(id),
    queryFn: ({ signal }) => getBooking(id, signal),
  });

export function useBooking(id: string) {
  return useQuery({ ...bookingQueryOptions(id), enabled: !!id });
}
