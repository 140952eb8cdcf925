import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Page } from '../../../../shared/lists/page';
import { fleetKeys } from './keys';
import type { AssetHistoryEntry } from '../../../../shared/assets/views';

export function getAssetHistory(id: string, signal?: AbortSignal): Promise<Page<AssetHistoryEntry>> {
  return apiClient.get<Page<AssetHistoryEntry>>(`/assets/${encodeURIComponent(id)}/history`, { signal });
}

export const assetHistoryQueryOptions = (id: string) =>
  queryOptions({
    queryKey: fleetKeys.history(id),
    queryFn: ({ signal }) => getAssetHistory(id, signal),
  });

export function useAssetHistory(id: string) {
  return useQuery(assetHistoryQueryOptions(id));
}
