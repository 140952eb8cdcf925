import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { routinesKeys } from './keys';
import type { JobRun } from './types';

export function runRoutine(name: string): Promise<{ run: JobRun }> {
  return apiClient.post<{ run: JobRun }>(`/admin/routines/${encodeURIComponent(name)}/run`);
}

export function useRunRoutine() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runRoutine,
    onSettled: () => queryClient.invalidateQueries({ queryKey: routinesKeys.all }),
  });
}
