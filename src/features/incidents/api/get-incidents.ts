import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { incidentsKeys, type IncidentListParams } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { IncidentView } from '../../../../shared/incidents/views';

export function getIncidents(params: IncidentListParams, signal?: AbortSignal): Promise<Page<IncidentView>> {
  return apiClient.get<Page<IncidentView>>('/incidents', {
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
