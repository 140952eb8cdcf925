import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { kitsKeys } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { AssetView } from '../../../../shared/assets/views';

/** Assets in no kit yet, matching a search (GET /api/assets?kitId=none&q=), to add to a kit. */
export function getKitCandidates(q: string, signal?: AbortSignal): Promise<Page<AssetView>> {
  return apiClient.get<Page<AssetView>>('/assets', {
    query: { kitId: 'none', q: q.trim() || undefined, sort: 'assetTag', limit: 20 },
    signal,
  });
}

export const kitCandidatesQueryOptions = (q: string) =>
  queryOptions({
    queryKey: kitsKeys.candidates(q),
    queryFn: ({ signal }) => getKitCandidates(q, signal),
    placeholderData: keepPreviousData,
    staleTime: 5_000,
  });

export function useKitCandidates(q: string) {
  return useQuery(kitCandidatesQueryOptions(q));
}
