import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { AssetView } from '../../../../shared/assets/views';
import type { Page } from '../../../../shared/lists/page';
import { rentalsKeys } from './keys';

/** Items for the rental form: a search by tag, type or model, or a kit's packing list. */
export function getAssetChoices(filter: { q?: string; kitId?: string }, signal?: AbortSignal): Promise<Page<AssetView>> {
  return apiClient.get<Page<AssetView>>('/assets', {
    query: { q: filter.q, kitId: filter.kitId, sort: 'assetTag', limit: filter.kitId ? 500 : 10, offset: 0 },
    signal,
  });
}

export const assetChoicesQueryOptions = (filter: { q?: string; kitId?: string }) =>
  queryOptions({ queryKey: rentalsKeys.assetChoices(filter), queryFn: ({ signal }) => getAssetChoices(filter, signal), placeholderData: keepPreviousData });

/** Nothing is asked while the filter is empty. */
export function useAssetChoices(filter: { q?: string; kitId?: string }) {
  return useQuery({ ...assetChoicesQueryOptions(filter), enabled: !!(filter.q || filter.kitId) });
}
