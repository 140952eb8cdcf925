import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { authKeys } from './keys';
import type { AccountSessionView } from '../../../../shared/auth/views';

export const getSessions = (signal?: AbortSignal) => apiClient.get<{ items: AccountSessionView[] }>('/account/sessions', { signal });
export const sessionsQueryOptions = () => queryOptions({ queryKey: authKeys.sessions(), queryFn: ({ signal }) => getSessions(signal) });
export const useSessions = () => useQuery(sessionsQueryOptions());

export const endSession = (id: string) => apiClient.delete<void>(`/account/sessions/${encodeURIComponent(id)}`);
export function useEndSession() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: endSession, onSuccess: () => queryClient.invalidateQueries({ queryKey: authKeys.sessions() }) });
}

export const signOutEverywhere = () => apiClient.post<void>('/account/sign-out-everywhere');
/** Every session ends, this one too: then `onSignedOut` (to the sign-in page) and nothing cached stays. */
export function useSignOutEverywhere({ onSignedOut }: { onSignedOut: () => void }) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOutEverywhere,
    onSuccess: () => {
      onSignedOut();
      queryClient.removeQueries();
    },
  });
}
