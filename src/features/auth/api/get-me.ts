import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from './keys';
import type { SessionView } from '../../../../shared/auth/views';

export function getMe(signal?: AbortSignal): Promise<SessionView> {
  return apiClient.get<SessionView>('/auth/me', { signal });
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}
