import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { jobsKeys } from './keys';
import type { JobRun } from './types';

export function runJob(name: string): Promise<{ run: JobRun }> {
  return apiClient.post<{ run: JobRun }>(`/admin/jobs/${encodeURIComponent(name)}/run`);
}

export function useRunJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runJob,
    onSettled: () => queryClient.invalidateQueries({ queryKey: jobsKeys.all }),
  });
}
