import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateBookingBoard } from '../../../lib/asset-status';
import { siteJobsKeys } from './keys';
import type { SiteJobView } from '../../../../shared/bookings/views';
import type { SiteJobInput } from './create-site-job';

export function updateSiteJob({ id, ...input }: SiteJobInput & { id: string }): Promise<SiteJobView> {
  return apiClient.put<SiteJobView>(`/jobs/${encodeURIComponent(id)}`, input);
}

export function useUpdateSiteJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSiteJob,
    onSuccess: (job) => {
      queryClient.setQueryData(siteJobsKeys.one(job.id), job);
      // Bookings show the job's reference and customer: those lists refresh too.
      return Promise.all([queryClient.invalidateQueries({ queryKey: siteJobsKeys.all }), invalidateBookingBoard(queryClient)]);
    },
  });
}
