import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import { bookingsKeys } from './keys';
import type { HandoverInput, ReturnResult } from './types';

/** POST /api/bookings/:id/return — missing or damaged items come back with an incident each (and go on hold). */
export function returnBooking({ id, ...input }: HandoverInput & { id: string }): Promise<ReturnResult> {
  return apiClient.post<ReturnResult>(`/bookings/${encodeURIComponent(id)}/return`, input);
}

export function useReturnBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: returnBooking,
    onSuccess: ({ incidents: _incidents, ...booking }) => {
      queryClient.setQueryData(bookingsKeys.one(booking.id), booking);
      // Statuses change (back to ready, or held with an incident): refresh the fleet's views and any incident lists.
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: bookingsKeys.all }),
        invalidateAssetStatus(queryClient),
        queryClient.invalidateQueries({ queryKey: ['incidents'] }),
      ]);
    },
  });
}
