import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { settingsKeys } from './keys';
import type { OrganizationSettings } from './types';

export function getSettings(signal?: AbortSignal): Promise<OrganizationSettings> {
  return apiClient.get<OrganizationSettings>('/settings', { signal });
}

export const settingsQueryOptions = () =>
  queryOptions({
    queryKey: settingsKeys.current(),
    queryFn: ({ signal }) => getSettings(signal),
    staleTime: 5 * 60_000,
  });

export function useSettings() {
  return useQuery(settingsQueryOptions());
}
