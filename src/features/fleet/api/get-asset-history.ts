import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { AssetHistoryEntry } from './types';

export function getAssetHistory(id: string, signal?: AbortSignal): Promise<{ items: AssetHistoryEntry[] }> {
  return apiClient.get<{ items: AssetHistoryEntry[] }>(`/assets/${encodeURIComponent(id)}/history`, { signal });
}

export const assetHistoryQueryOptions = (id: string) =>
  queryOptions({
    queryKey: fleetKeys.history(id),
    queryFn: ({ signal }) => getAssetHistory(id, signal),
  });

export function useAssetHistory(id: string) {
  return useQuery(assetHistoryQueryOptions(id));
}
