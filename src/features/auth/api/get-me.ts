import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from './keys';
import type { SessionProbeView, SessionView } from '../../../../shared/auth/views';

/** Who is signed in, or `null`: the session probe answers 200 either way, so a signed-out start logs no error. */
export async function getMe(signal?: AbortSignal): Promise<SessionView | null> {
  return (await apiClient.get<SessionProbeView>('/auth/session', { signal })).session;
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
