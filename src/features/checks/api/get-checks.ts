import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { checksKeys } from './keys';
import type { CheckListParams, CheckPage } from './types';

export function getChecks(params: CheckListParams, signal?: AbortSignal): Promise<CheckPage> {
  return apiClient.get<CheckPage>('/checks', { query: { ...params }, signal });
}

export const checksQueryOptions = (params: CheckListParams) =>
  queryOptions({
    queryKey: checksKeys.list(params),
    queryFn: ({ signal }) => getChecks(params, signal),
    placeholderData: keepPreviousData,
  });

export function useChecks(params: CheckListParams, options: { enabled?: boolean } = {}) {
  return useQuery({ ...checksQueryOptions(params), enabled: options.enabled ?? true });
}
