import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys } from './keys';
import type { CounterDay } from './types';

/** GET /api/bookings/today — the counter's day: checkouts, returns, late returns, blocked bookings. */
export function getCounterDay(signal?: AbortSignal): Promise<CounterDay> {
  return apiClient.get<CounterDay>('/bookings/today', { signal });
}

export const counterDayQueryOptions = () =>
  queryOptions({ queryKey: bookingsKeys.today(), queryFn: ({ signal }) => getCounterDay(signal) });

export function useCounterDay() {
  return useQuery(counterDayQueryOptions());
}
