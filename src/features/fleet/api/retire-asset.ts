import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { AssetView } from '../../../../shared/assets/views';

export interface RetireAssetInput {
  id: string;
  reason: string;
}

export function retireAsset({ id, reason }: RetireAssetInput): Promise<AssetView> {
  return apiClient.post<AssetView>(`/assets/${encodeURIComponent(id)}/retire`, { reason });
}

export function useRetireAsset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retireAsset,
    onSuccess: (asset) => {
      queryClient.setQueryData(fleetKeys.one(asset.id), asset);
      return queryClient.invalidateQueries({ queryKey: fleetKeys.all });
    },
  });
}
