import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { kitsKeys } from './keys';
import type { KitWithMembersView } from '../../../../shared/assets/views';

export function getKit(id: string, signal?: AbortSignal): Promise<KitWithMembersView> {
  return apiClient.get<KitWithMembersView>(`/kits/${encodeURIComponent(id)}`, { signal });
}

export const kitQueryOptions = (id: string) =>
  queryOptions({
    queryKey: kitsKeys.one(id),
    queryFn: ({ signal }) => getKit(id, signal),
  });

export function useKit(id: string) {
  return useQuery(kitQueryOptions(id));
}
