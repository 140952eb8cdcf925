import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { jobsKeys } from './keys';
import type { ScheduledJobsView } from '../../../../shared/jobs/views';

export function getJobs(signal?: AbortSignal): Promise<ScheduledJobsView> {
  return apiClient.get<ScheduledJobsView>('/admin/jobs', { signal });
}

export const jobsQueryOptions = () =>
  queryOptions({
    queryKey: jobsKeys.list(),
    queryFn: ({ signal }) => getJobs(signal),
    // While any job is running, look again every few seconds.
    refetchInterval: (query) =>
      query.state.data?.items.some((job) => job.lastRun?.status === 'running') ? 3_000 : false,
  });

export function useJobs() {
  return useQuery(jobsQueryOptions());
}
