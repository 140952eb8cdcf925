import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { siteJobsKeys } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { SiteJobView } from '../../../../shared/bookings/views';

export function getSiteJobs(page: { limit: number; offset: number }, signal?: AbortSignal): Promise<Page<SiteJobView>> {
  return apiClient.get<Page<SiteJobView>>('/jobs', { query: page, signal });
}

export const siteJobsQueryOptions = (page = { limit: 500, offset: 0 }) =>
  queryOptions({ queryKey: siteJobsKeys.list(page), queryFn: ({ signal }) => getSiteJobs(page, signal) });

export function useSiteJobs(page?: { limit: number; offset: number }) {
  return useQuery(siteJobsQueryOptions(page));
}
