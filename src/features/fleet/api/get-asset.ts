import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { AssetView } from '../../../../shared/assets/views';

export function getAsset(id: string, signal?: AbortSignal): Promise<AssetView> {
  return apiClient.get<AssetView>(`/assets/${encodeURIComponent(id)}`, { signal });
}

export const assetQueryOptions = (id: string) =>
  queryOptions({
    queryKey: fleetKeys.one(id),
    queryFn: ({ signal }) => getAsset(id, signal),
  });

export function useAsset(id: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...assetQueryOptions(id), enabled: options.enabled ?? !!id });
}
