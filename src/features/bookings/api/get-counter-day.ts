import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys } from './keys';
import type { CounterDayView } from '../../../../shared/bookings/views';

/** GET /api/bookings/today — the counter's day: checkouts, returns, late returns, blocked bookings. */
export function getCounterDay(signal?: AbortSignal): Promise<CounterDayView> {
  return apiClient.get<CounterDayView>('/bookings/today', { signal });
}

export const counterDayQueryOptions = () => queryOptions({ queryKey: bookingsKeys.today(), queryFn: ({ signal }) => getCounterDay(signal) });

export function useCounterDay() {
  return useQuery(counterDayQueryOptions());
}
