import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../lib/roles';
import { usersKeys } from './keys';
import type { UserView } from '../../../../shared/users/views';

export interface CreateUserInput {
  email: string;
  name: string;
  role: Role;
  password: string;
}

export function createUser(input: CreateUserInput): Promise<UserView> {
  return apiClient.post<UserView>('/users', input);
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersKeys.all }),
  });
}
