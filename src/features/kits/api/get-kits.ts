import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { kitsKeys } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { KitView } from '../../../../shared/assets/views';

export function getKits(page: { limit: number; offset: number }, signal?: AbortSignal): Promise<Page<KitView>> {
  return apiClient.get<Page<KitView>>('/kits', { query: page, signal });
}

export const kitsQueryOptions = (page = { limit: 500, offset: 0 }) =>
  queryOptions({
    queryKey: kitsKeys.list(page),
    queryFn: ({ signal }) => getKits(page, signal),
  });

export function useKits(page?: { limit: number; offset: number }) {
  return useQuery(kitsQueryOptions(page));
}
