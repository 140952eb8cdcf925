import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { routinesKeys } from './keys';
import type { RoutineRunReply } from '../../../../shared/routines/views';

export function runRoutine(name: string): Promise<RoutineRunReply> {
  return apiClient.post<RoutineRunReply>(`/admin/routines/${encodeURIComponent(name)}/run`);
}

export function useRunRoutine() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runRoutine,
    onSettled: () => queryClient.invalidateQueries({ queryKey: routinesKeys.all }),
  });
}
