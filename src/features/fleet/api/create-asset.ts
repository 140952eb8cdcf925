import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { AssetView, CreateAssetInput } from './types';

export function createAsset(input: CreateAssetInput): Promise<AssetView> {
  return apiClient.post<AssetView>('/assets', input);
}

export function useCreateAsset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAsset,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fleetKeys.all }),
  });
}
