import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import { calibrationKeys } from './keys';
import type { CalibrationEventView } from '../../../../shared/calibration/views';

export function decideInterval(eventId: string, decision: 'accept' | 'decline'): Promise<CalibrationEventView> {
  return apiClient.post<CalibrationEventView>(`/calibrations/${encodeURIComponent(eventId)}/interval`, { decision });
}

/** Accepting moves the item's interval and due date. */
export function useDecideInterval() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ eventId, decision }: { eventId: string; decision: 'accept' | 'decline' }) => decideInterval(eventId, decision),
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: calibrationKeys.all }), invalidateAssetStatus(queryClient)]),
  });
}
