import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { incidentsKeys } from './keys';
import type { IncidentView } from '../../../../shared/incidents/views';

export function getIncident(id: string, signal?: AbortSignal): Promise<IncidentView> {
  return apiClient.get<IncidentView>(`/incidents/${encodeURIComponent(id)}`, { signal });
}

export const incidentQueryOptions = (id: string) =>
  queryOptions({
    queryKey: incidentsKeys.one(id),
    queryFn: ({ signal }) => getIncident(id, signal),
  });

export function useIncident(id: string) {
  return useQuery({ ...incidentQueryOptions(id), enabled: !!id });
}
