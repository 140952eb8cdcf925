import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateBookingBoard } from '../../../lib/asset-status';
import { calibrationKeys } from './keys';
import type { LabTripView } from '../../../../shared/calibration/views';

/** 409 `conflict` with `details.conflicts` when an item is booked in that window. */
export interface PlanLabTripInput {
  provider: string;
  assetIds: string[];
  sentOn: string;
  expectedBackOn?: string;
}

export function planLabTrip(input: PlanLabTripInput): Promise<LabTripView> {
  return apiClient.post<LabTripView>('/lab-trips', input);
}

/** The trip reserves its window as a lab booking on the board. */
export function usePlanLabTrip() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: planLabTrip,
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: calibrationKeys.all }), invalidateBookingBoard(queryClient)]),
  });
}
