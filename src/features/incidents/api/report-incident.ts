import { useMutation, useQueryClient } from '@tanstack/react-query';
import { csrfToken } from '../../../lib/api-client';
import { invalidateAssetStatus } from '../../../lib/asset-status';
import { queueFieldRecord } from '../../../lib/field/outbox';
import { incidentsKeys } from './keys';
import type { IncidentKind } from '../../../../shared/incidents/vocabulary';
import type { IncidentView } from '../../../../shared/incidents/views';

export interface ReportIncidentInput {
  /** Made on the phone with the form: the report's id and its idempotency key. */
  id: string;
  userId: string;
  title: string;
  assetId: string;
  kind: IncidentKind;
  description: string;
  /** ISO date-time with offset: when it happened, whenever the report reaches the server. */
  occurredAt: string;
  location?: string;
  bookingId?: string;
  photos: File[];
  /** The form's values, to open it again if the server refuses the report. */
  draft: unknown;
}

export type ReportOutcome = { state: 'sent'; incident: IncidentView } | { state: 'waiting' };

/** POST /api/incidents (multipart, photos under "photos") through the phone's outbox: the photos are kept on the phone until sent. */
export async function reportIncident(input: ReportIncidentInput): Promise<ReportOutcome> {
  const fields: Record<string, string> & { id: string } = {
    id: input.id,
    assetId: input.assetId,
    kind: input.kind,
    description: input.description,
    occurredAt: input.occurredAt,
  };
  if (input.location) fields.location = input.location;
  if (input.bookingId) fields.bookingId = input.bookingId;
  const photos = input.photos.map((p) => ({ name: p.name, type: p.type, size: p.size, blob: p as Blob }));
  const outcome = await queueFieldRecord(
    { id: input.id, userId: input.userId, title: input.title, assetId: input.assetId, request: { kind: 'incident', fields, photos }, draft: input.draft },
    csrfToken,
  );
  return outcome.state === 'sent' ? { state: 'sent', incident: outcome.reply as IncidentView } : outcome;
}

/** The item is held at once, so the fleet, kits and holds read again too. Runs without signal as well. */
export function useReportIncident() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: reportIncident,
    networkMode: 'always',
    onSuccess: (outcome) => {
      if (outcome.state !== 'sent') return;
      queryClient.setQueryData(incidentsKeys.one(outcome.incident.id), outcome.incident);
      return Promise.all([queryClient.invalidateQueries({ queryKey: incidentsKeys.all }), invalidateAssetStatus(queryClient)]);
    },
  });
}
