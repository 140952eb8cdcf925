import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient, uploadForm } from '../../../lib/api-client';
import { incidentsQueryRoot, invalidateAssetStatus } from '../../../lib/asset-status';
import type { HandoverInput } from './check-out-booking';
import { bookingsKeys } from './keys';
import type { ReturnView } from '../../../../shared/bookings/views';

/** A photo of the damage taken at return, with the item it shows. */
export type ReturnPhoto = { assetId: string; file: File };

/**
 * POST /api/bookings/:id/return — missing or damaged items come back with an incident each (and go on hold). With photos it is one
 * multipart form: the checklist as JSON, and `photoAssetIds` naming each photo's item in order.
 */
export function returnBooking({ id, photos = [], ...input }: HandoverInput & { id: string; photos?: ReturnPhoto[] }): Promise<ReturnView> {
  const path = `/bookings/${encodeURIComponent(id)}/return`;
  if (!photos.length) return apiClient.post<ReturnView>(path, input);
  const form = new FormData();
  form.append('counterpart', input.counterpart);
  form.append('checklist', JSON.stringify(input.checklist));
  form.append('photoAssetIds', photos.map((p) => p.assetId).join(','));
  for (const p of photos) form.append('photos', p.file, p.file.name);
  return uploadForm<ReturnView>(path, form);
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
