import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { jobsKeys } from './keys';
import type { JobRunReply } from '../../../../shared/jobs/views';

export function runJob(name: string): Promise<JobRunReply> {
  return apiClient.post<JobRunReply>(`/admin/jobs/${encodeURIComponent(name)}/run`);
}

export function useRunJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runJob,
    onSettled: () => queryClient.invalidateQueries({ queryKey: jobsKeys.all }),
  });
}
