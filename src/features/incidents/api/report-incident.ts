import { useMutation, useQueryClient } from '@tanstack/react-query';
import { uploadForm } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import { incidentsKeys } from './keys';
import type { IncidentKind } from '../../../../shared/incidents/vocabulary';
import type { IncidentView } from '../../../../shared/incidents/views';

export interface ReportIncidentInput {
  assetId: string;
  kind: IncidentKind;
  description: string;
  /** ISO date-time with offset. */
  occurredAt: string;
  location?: string;
  bookingId?: string;
  photos: File[];
}

/** Multipart: the text fields, then up to six photos under "photos"; progress 0…1 as it goes up. */
export function reportIncident(input: ReportIncidentInput, onProgress?: (fraction: number) => void): Promise<IncidentView> {
  const form = new FormData();
  form.set('assetId', input.assetId);
  form.set('kind', input.kind);
  form.set('description', input.description);
  form.set('occurredAt', input.occurredAt);
  if (input.location) form.set('location', input.location);
  if (input.bookingId) form.set('bookingId', input.bookingId);
  for (const photo of input.photos) form.append('photos', photo, photo.name);
  return uploadForm<IncidentView>('/incidents', form, { onProgress });
}

/** The item is held at once, so the fleet, kits and holds read again too. */
export function useReportIncident(onProgress?: (fraction: number) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReportIncidentInput) => reportIncident(input, onProgress),
    onSuccess: (incident) => {
      queryClient.setQueryData(incidentsKeys.one(incident.id), incident);
      return Promise.all([queryClient.invalidateQueries({ queryKey: incidentsKeys.all }), invalidateAssetStatus(queryClient)]);
    },
  });
}
