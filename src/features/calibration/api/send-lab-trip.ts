import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateAssetStatus, invalidateBookingBoard } from '../../../lib/asset-status';
import { calibrationKeys } from './keys';
import type { LabTripView } from '../../../../shared/calibration/views';

export function sendLabTrip(tripId: string): Promise<LabTripView> {
  return apiClient.post<LabTripView>(`/lab-trips/${encodeURIComponent(tripId)}/send`);
}

/** The items go `at_lab` and the lab booking goes out. */
export function useSendLabTrip() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: sendLabTrip,
    onSuccess: () =>
      Promise.all([queryClient.invalidateQueries({ queryKey: calibrationKeys.all }), invalidateAssetStatus(queryClient), invalidateBookingBoard(queryClient)]),
  });
}
