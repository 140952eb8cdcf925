import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import type { HoldView } from '../../../../shared/holds/views';

export interface HoldAssetInput {
  assetId: string;
  summary: string;
}

/** Takes an item out of service by hand. */
export function holdAsset({ assetId, summary }: HoldAssetInput): Promise<HoldView> {
  return apiClient.post<HoldView>(`/assets/${encodeURIComponent(assetId)}/hold`, { summary });
}

export function useHoldAsset() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: holdAsset, onSuccess: () => invalidateAssetStatus(queryClient) });
}
