import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { settingsKeys } from './keys';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';

export function getSettings(signal?: AbortSignal): Promise<OrganizationSettingsView> {
  return apiClient.get<OrganizationSettingsView>('/settings', { signal });
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
