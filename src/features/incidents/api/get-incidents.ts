import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { incidentsKeys } from './keys';
import type { IncidentListParams, IncidentPage } from './types';

export function getIncidents(params: IncidentListParams, signal?: AbortSignal): Promise<IncidentPage> {
  return apiClient.get<IncidentPage>('/incidents', {
    query: { assetId: params.assetId, state: params.state?.length ? params.state.join(',') : undefined, limit: params.limit, offset: params.offset },
    signal,
  });
}

export const incidentsQueryOptions = (params: IncidentListParams) =>
  queryOptions({
    queryKey: incidentsKeys.list(params),
    queryFn: ({ signal }) => getIncidents(params, signal),
    placeholderData: keepPreviousData,
  });

export function useIncidents(params: IncidentListParams, options: { enabled?: boolean } = {}) {
  return useQuery({ ...incidentsQueryOptions(params), enabled: options.enabled ?? true });
}
