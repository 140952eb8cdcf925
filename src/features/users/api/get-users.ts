import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { usersKeys } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { UserView } from '../../../../shared/users/views';

export function getUsers(signal?: AbortSignal): Promise<Page<UserView>> {
  return apiClient.get<Page<UserView>>('/users', { signal });
}

export const usersQueryOptions = () =>
  queryOptions({
    queryKey: usersKeys.list(),
    queryFn: ({ signal }) => getUsers(signal),
  });

export function useUsers() {
  return useQuery(usersQueryOptions());
}
