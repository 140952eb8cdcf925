import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../lib/roles';
import { usersKeys } from './keys';
import type { User } from './types';

export interface UpdateUserInput {
  id: string;
  name?: string;
  role?: Role;
  disabled?: boolean;
}

export function updateUser({ id, ...changes }: UpdateUserInput): Promise<User> {
  return apiClient.patch<User>(`/users/${encodeURIComponent(id)}`, changes);
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersKeys.all }),
  });
}
