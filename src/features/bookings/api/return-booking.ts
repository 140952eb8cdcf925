import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { incidentsQueryRoot, invalidateAssetStatus } from '../../../lib/asset-status';
import type { HandoverInput } from './check-out-booking';
import { bookingsKeys } from './keys';
import type { ReturnView } from '../../../../shared/bookings/views';

/** POST /api/bookings/:id/return — missing or damaged items come back with an incident each (and go on hold). */
export function returnBooking({ id, ...input }: HandoverInput & { id: string }): Promise<ReturnView> {
  return apiClient.post<ReturnView>(`/bookings/${encodeURIComponent(id)}/return`, input);
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
        queryClient.invalidateQueries({ queryKey: incidentsQueryRoot }),
      ]);
    },
  });
}
