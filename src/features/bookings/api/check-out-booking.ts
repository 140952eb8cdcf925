import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import { bookingsKeys } from './keys';
import type { BookingView, ChecklistLine } from '../../../../shared/bookings/views';

/** The packing list as walked at the counter, and who takes (or brings back) the kit: a name or a user id. */
export interface HandoverInput {
  checklist: ChecklistLine[];
  counterpart: string;
  /** Checkout before the window opens: why (recorded). */
  earlyReason?: string;
  /** Checkout of a reservation not collected: why, and the new last day. */
  late?: { note: string; endsOn: string };
}

/** POST /api/bookings/:id/checkout — the kit leaves against its packing list. */
export function checkOutBooking({ id, ...input }: HandoverInput & { id: string }): Promise<BookingView> {
  return apiClient.post<BookingView>(`/bookings/${encodeURIComponent(id)}/checkout`, input);
}

export function useCheckOutBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: checkOutBooking,
    onSuccess: (booking) => {
      queryClient.setQueryData(bookingsKeys.one(booking.id), booking);
      // The items are now out: fleet lists, kit readiness and holds change too.
      return Promise.all([queryClient.invalidateQueries({ queryKey: bookingsKeys.all }), invalidateAssetStatus(queryClient)]);
    },
  });
}
