import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { usersKeys } from './keys';
import type { UserView } from '../../../../shared/users/views';

/** The owner clears a colleague's second step (a lost phone); the server records it in the audit trail. */
export const clearSecondStep = (id: string) => apiClient.delete<UserView>(`/users/${encodeURIComponent(id)}/second-step`);

export function useClearSecondStep() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: clearSecondStep, onSuccess: () => queryClient.invalidateQueries({ queryKey: usersKeys.list() }) });
}
