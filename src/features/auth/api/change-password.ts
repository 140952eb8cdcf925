import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';

export interface ChangePasswordInput {
  currentPassword: string;
  newPassword: string;
}

export function changePassword(input: ChangePasswordInput): Promise<void> {
  return apiClient.post<void>('/auth/password', input);
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
