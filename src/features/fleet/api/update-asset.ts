import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { AssetInput, AssetView } from './types';

export interface UpdateAssetInput {
  id: string;
  changes: Partial<AssetInput>;
}

export function updateAsset({ id, changes }: UpdateAssetInput): Promise<AssetView> {
  return apiClient.patch<AssetView>(`/assets/${encodeURIComponent(id)}`, changes);
}

export function useUpdateAsset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateAsset,
    onSuccess: (asset) => {
      queryClient.setQueryData(fleetKeys.one(asset.id), asset);
      return queryClient.invalidateQueries({ queryKey: fleetKeys.all });
    },
  });
}
