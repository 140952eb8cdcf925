import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { incidentsKeys } from './keys';
import type { IncidentView } from '../../../../shared/incidents/views';

export interface UpdateIncidentInput {
  id: string;
  state?: 'reviewing' | 'resolved';
  resolution?: string | null;
  chargeAmountMinor?: number | null;
}

/** Start the review or resolve (a resolution is required; a charge in minor units is optional). */
export function updateIncident({ id, ...changes }: UpdateIncidentInput): Promise<IncidentView> {
  return apiClient.patch<IncidentView>(`/incidents/${encodeURIComponent(id)}`, changes);
}

export function useUpdateIncident() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateIncident,
    onSuccess: (incident) => {
      queryClient.setQueryData(incidentsKeys.one(incident.id), incident);
      return queryClient.invalidateQueries({ queryKey: incidentsKeys.all });
    },
  });
}
