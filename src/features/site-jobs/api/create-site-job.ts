import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { siteJobsKeys } from './keys';
import type { SiteJobView } from '../../../../shared/bookings/views';

/** What the job form sends (POST and PUT /api/jobs). */
export type SiteJobInput = Omit<SiteJobView, 'id'>;

export function createSiteJob(input: SiteJobInput): Promise<SiteJobView> {
  return apiClient.post<SiteJobView>('/jobs', input);
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
