import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys } from './keys';
import type { MyKitView } from '../../../../shared/bookings/views';

/** GET /api/bookings/mine — kit the signed-in technician carries now and next. */
export function getMyKit(signal?: AbortSignal): Promise<MyKitView> {
  return apiClient.get<MyKitView>('/bookings/mine', { signal });
}

export const myKitQueryOptions = () => queryOptions({ queryKey: bookingsKeys.mine(), queryFn: ({ signal }) => getMyKit(signal) });

export function useMyKit() {
  return useQuery(myKitQueryOptions());
}
