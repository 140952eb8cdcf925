import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../lib/roles';
import { usersKeys } from './keys';
import type { User } from './types';

export interface CreateUserInput {
  email: string;
  name: string;
  role: Role;
  password: string;
}

export function createUser(input: CreateUserInput): Promise<User> {
  return apiClient.post<User>('/users', input);
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersKeys.all }),
  });
}
