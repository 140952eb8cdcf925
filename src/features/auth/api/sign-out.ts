import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { eraseFieldData } from '../../../lib/field/outbox';
import { authKeys } from './keys';

export function signOut(): Promise<void> {
  return apiClient.post<void>('/auth/logout');
}

/**
 * Ends the session on the server, then (even if the server was unreachable)
 * erases the field copy and outbox on this phone, calls `onSignedOut` — usually
 * a navigation to /sign-in — and drops every cached answer on this device.
 */
export function useSignOut({ onSignedOut }: { onSignedOut?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey: [...authKeys.all, 'sign-out'],
    mutationFn: signOut,
    onSettled: async () => {
      await eraseFieldData();
      onSignedOut?.();
      queryClient.removeQueries();
    },
  });
}
