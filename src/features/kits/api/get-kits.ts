import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { kitsKeys } from './keys';
import type { KitPage } from './types';

export function getKits(page: { limit: number; offset: number }, signal?: AbortSignal): Promise<KitPage> {
  return apiClient.get<KitPage>('/kits', { query: page, signal });
}

export const kitsQueryOptions = (page = { limit: 500, offset: 0 }) =>
  queryOptions({
    queryKey: kitsKeys.list(page),
    queryFn: ({ signal }) => getKits(page, signal),
  });

export function useKits(page?: { limit: number; offset: number }) {
  return useQuery(kitsQueryOptions(page));
}
