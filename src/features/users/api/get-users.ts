import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { usersKeys } from './keys';
import type { UserList } from './types';

export function getUsers(signal?: AbortSignal): Promise<UserList> {
  return apiClient.get<UserList>('/users', { signal });
}

export const usersQueryOptions = () =>
  queryOptions({
    queryKey: usersKeys.list(),
    queryFn: ({ signal }) => getUsers(signal),
  });

export function useUsers() {
  return useQuery(usersQueryOptions());
}
