import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';

export interface ResetUserPasswordInput {
  id: string;
  password: string;
}

export function resetUserPassword({ id, password }: ResetUserPasswordInput): Promise<void> {
  return apiClient.post<void>(`/users/${encodeURIComponent(id)}/password`, { password });
}

export function useResetUserPassword() {
  return useMutation({ mutationFn: resetUserPassword });
}
