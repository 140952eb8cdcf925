import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { checksKeys } from './keys';

/** A tip position in the kit I carry now or next whose latest validation did not pass (or never happened). */
export interface CheckToDo {
  assetId: string;
  assetTag: string;
  position: string;
  lastDecision: 'pass' | 'fail' | null;
  lastCheckedAt: string | null;
  bookingId: string;
  startsOn: string;
  bookingState: 'out' | 'reserved';
}

export function getChecksToDo(signal?: AbortSignal): Promise<{ items: CheckToDo[]; total: number }> {
  return apiClient.get('/checks/to-do', { signal });
}

export const checksToDoQueryOptions = () => queryOptions({ queryKey: checksKeys.toDo(), queryFn: ({ signal }) => getChecksToDo(signal) });

export function useChecksToDo() {
  return useQuery(checksToDoQueryOptions());
}
