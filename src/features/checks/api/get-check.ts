import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { checksKeys } from './keys';
import type { CheckView } from '../../../../shared/checks/views';

export function getCheck(id: string, signal?: AbortSignal): Promise<CheckView> {
  return apiClient.get<CheckView>(`/checks/${encodeURIComponent(id)}`, { signal });
}

export const checkQueryOptions = (id: string) =>
  queryOptions({
    queryKey: checksKeys.one(id),
    queryFn: ({ signal }) => getCheck(id, signal),
  });

export function useCheck(id: string) {
  return useQuery({ ...checkQueryOptions(id), enabled: !!id });
}
