import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { checksKeys, type CheckListParams } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { CheckView } from '../../../../shared/checks/views';

export function getChecks(params: CheckListParams, signal?: AbortSignal): Promise<Page<CheckView>> {
  return apiClient.get<Page<CheckView>>('/checks', { query: { ...params }, signal });
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
