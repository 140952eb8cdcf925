import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateBookingBoard } from '../../../lib/asset-status';
import { calibrationKeys } from './keys';
import type { LabTrip, PlanLabTripInput } from './types';

/** 409 `conflict` with `details.conflicts` when an item is booked in that window. */
export function planLabTrip(input: PlanLabTripInput): Promise<LabTrip> {
  return apiClient.post<LabTrip>('/lab-trips', input);
}

/** The trip reserves its window as a lab booking on the board. */
export function usePlanLabTrip() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: planLabTrip,
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: calibrationKeys.all }), invalidateBookingBoard(queryClient)]),
  });
}
