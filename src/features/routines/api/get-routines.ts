import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { routinesKeys } from './keys';
import type { RoutinesView } from '../../../../shared/routines/views';

export function getRoutines(signal?: AbortSignal): Promise<RoutinesView> {
  return apiClient.get<RoutinesView>('/admin/routines', { signal });
}

export const routinesQueryOptions = () =>
  queryOptions({
    queryKey: routinesKeys.list(),
    queryFn: ({ signal }) => getRoutines(signal),
    // While any routine is running, look again every few seconds.
    refetchInterval: (query) => (query.state.data?.items.some((routine) => routine.lastRun?.status === 'running') ? 3_000 : false),
  });

export function useRoutines() {
  return useQuery(routinesQueryOptions());
}
