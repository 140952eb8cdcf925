import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { fleetKeys, type AssetFilter, type AssetListParams } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { AssetView } from '../../../../shared/assets/views';

/** The filter as the API's query string values (lists comma-separated, empty ones left out). */
export function assetFilterQuery(filter: AssetFilter): Record<string, string | undefined> {
  const list = (values?: readonly string[]) => (values && values.length ? values.join(',') : undefined);
  return {
    q: filter.q?.trim() || undefined,
    type: list(filter.type),
    status: list(filter.status),
    calibration: list(filter.calibration),
    kitId: filter.kitId || undefined,
  };
}

export function getAssets(params: AssetListParams, signal?: AbortSignal): Promise<Page<AssetView>> {
  return apiClient.get<Page<AssetView>>('/assets', {
    query: { ...assetFilterQuery(params), sort: params.sort, limit: params.limit, offset: params.offset },
    signal,
  });
}

export const assetsQueryOptions = (params: AssetListParams) =>
  queryOptions({
    queryKey: fleetKeys.list(params),
    queryFn: ({ signal }) => getAssets(params, signal),
    placeholderData: keepPreviousData,
  });

export function useAssets(params: AssetListParams, options: { enabled?: boolean } = {}) {
  return useQuery({ ...assetsQueryOptions(params), enabled: options.enabled ?? true });
}
