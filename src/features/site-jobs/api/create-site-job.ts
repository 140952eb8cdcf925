import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { siteJobsKeys } from './keys';
import type { SiteJob, SiteJobInput } from './types';

export function createSiteJob(input: SiteJobInput): Promise<SiteJob> {
  return apiClient.post<SiteJob>('/jobs', input);
}

export function useCreateSiteJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSiteJob,
    onSuccess: (job) => {
      queryClient.setQueryData(siteJobsKeys.one(job.id), job);
      return queryClient.invalidateQueries({ queryKey: siteJobsKeys.all });
    },
  });
}
