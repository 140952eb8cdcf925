import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { siteJobsKeys } from './keys';
import type { SiteJob, SiteJobInput } from './types';

export function updateSiteJob({ id, ...input }: SiteJobInput & { id: string }): Promise<SiteJob> {
  return apiClient.put<SiteJob>(`/jobs/${encodeURIComponent(id)}`, input);
}

export function useUpdateSiteJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSiteJob,
    onSuccess: (job) => {
      queryClient.setQueryData(siteJobsKeys.one(job.id), job);
      // Bookings show the job's reference and customer: those lists refresh too.
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: siteJobsKeys.all }),
        queryClient.invalidateQueries({ queryKey: ['bookings'] }),
      ]);
    },
  });
}
