import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { checksKeys } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { CheckToDo } from '../../../../shared/checks/views';

export function getChecksToDo(signal?: AbortSignal): Promise<Page<CheckToDo>> {
  return apiClient.get<Page<CheckToDo>>('/checks/to-do', { signal });
}

export const checksToDoQueryOptions = () => queryOptions({ queryKey: checksKeys.toDo(), queryFn: ({ signal }) => getChecksToDo(signal) });

export function useChecksToDo() {
  return useQuery(checksToDoQueryOptions());
}
