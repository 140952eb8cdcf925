import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient, isApiError } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import type { HoldView } from '../../../../shared/holds/views';

export interface ReleaseAssetInput {
  assetId: string;
  note?: string;
}

export function releaseAsset({ assetId, note }: ReleaseAssetInput): Promise<HoldView> {
  return apiClient.post<HoldView>(`/assets/${encodeURIComponent(assetId)}/release`, note ? { note } : {});
}

/** The plain sentences a 422 `release_needs_evidence` lists: why the item must stay on hold. */
export function missingEvidence(error: unknown): string[] | null {
  if (!isApiError(error) || error.code !== 'release_needs_evidence') return null;
  const missing = (error.details as { missing?: unknown } | undefined)?.missing;
  return Array.isArray(missing) ? missing.filter((m): m is string => typeof m === 'string') : [];
}

export function useReleaseAsset() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: releaseAsset, onSuccess: () => invalidateAssetStatus(queryClient) });
}
