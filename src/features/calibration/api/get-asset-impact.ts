import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { AssetImpactView } from '../../../../shared/calibration/views';

export function getAssetImpact(assetId: string, signal?: AbortSignal): Promise<AssetImpactView> {
  return apiClient.get<AssetImpactView>(`/assets/${encodeURIComponent(assetId)}/impact`, { signal });
}

/** The item's latest out-of-tolerance impact review, or `state: 'none'`. */
export const assetImpactQueryOptions = (assetId: string) =>
  queryOptions({ queryKey: calibrationKeys.impact(assetId), queryFn: ({ signal }) => getAssetImpact(assetId, signal) });

export function useAssetImpact(assetId: string) {
  return useQuery({ ...assetImpactQueryOptions(assetId), enabled: !!assetId });
}
