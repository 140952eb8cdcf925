import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../lib/roles';
import { usersKeys } from './keys';
import type { UserView } from '../../../../shared/users/views';

export interface UpdateUserInput {
  id: string;
  name?: string;
  role?: Role;
  disabled?: boolean;
}

export function updateUser({ id, ...changes }: UpdateUserInput): Promise<UserView> {
  return apiClient.patch<UserView>(`/users/${encodeURIComponent(id)}`, changes);
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersKeys.all }),
  });
}
