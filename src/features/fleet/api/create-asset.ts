import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { AssetView } from '../../../../shared/assets/views';
import type { CreateAssetPayload } from '../../../../shared/schemas/assets';

export function createAsset(input: CreateAssetPayload): Promise<AssetView> {
  return apiClient.post<AssetView>('/assets', input);
}

export function useCreateAsset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAsset,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fleetKeys.all }),
  });
}
