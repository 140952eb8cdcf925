import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { siteJobsKeys } from './keys';
import type { SiteJobView } from '../../../../shared/bookings/views';

export function getSiteJob(id: string, signal?: AbortSignal): Promise<SiteJobView> {
  return apiClient.get<SiteJobView>(`/jobs/${encodeURIComponent(id)}`, { signal });
}

export const siteJobQueryOptions = (id: string) => queryOptions({ queryKey: siteJobsKeys.one(id), queryFn: ({ signal }) => getSiteJob(id, signal) });

export function useSiteJob(id: string | null | undefined) {
  return useQuery({ ...siteJobQueryOptions(id ?? ''), enabled: !!id });
}
