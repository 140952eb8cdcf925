import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { AssetImpact } from './types';

export function getAssetImpact(assetId: string, signal?: AbortSignal): Promise<AssetImpact> {
  return apiClient.get<AssetImpact>(`/assets/${encodeURIComponent(assetId)}/impact`, { signal });
}

/** The item's latest out-of-tolerance impact review, or `state: 'none'`. */
export const assetImpactQueryOptions = (assetId: string) =>
  queryOptions({ queryKey: calibrationKeys.impact(assetId), queryFn: ({ signal }) => getAssetImpact(assetId, signal) });

export function useAssetImpact(assetId: string) {
  return useQuery({ ...assetImpactQueryOptions(assetId), enabled: !!assetId });
}
