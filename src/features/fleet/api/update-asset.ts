import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { AssetView } from '../../../../shared/assets/views';
import type { UpdateAssetPayload } from '../../../../shared/schemas/assets';

export interface UpdateAssetInput {
  id: string;
  changes: UpdateAssetPayload;
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
