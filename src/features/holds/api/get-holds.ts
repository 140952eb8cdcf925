import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { holdsKeys } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { HoldView } from '../../../../shared/holds/views';

/** An item's holds, newest first; the open one has no `releasedAt`. */
export function getHolds(assetId: string, signal?: AbortSignal): Promise<Page<HoldView>> {
  return apiClient.get<Page<HoldView>>(`/assets/${encodeURIComponent(assetId)}/holds`, { signal });
}

export const holdsQueryOptions = (assetId: string) =>
  queryOptions({
    queryKey: holdsKeys.forAsset(assetId),
    queryFn: ({ signal }) => getHolds(assetId, signal),
  });

export function useHolds(assetId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...holdsQueryOptions(assetId), enabled: (options.enabled ?? true) && !!assetId });
}
