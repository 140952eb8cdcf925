import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { checksKeys } from './keys';
import type { TipForecastsView } from '../../../../shared/checks/views';

/** A tip's drift forecast per mounting position (advice: it holds nothing). */
export function getTipForecast(assetId: string, signal?: AbortSignal): Promise<TipForecastsView> {
  return apiClient.get<TipForecastsView>(`/assets/${encodeURIComponent(assetId)}/tip-forecast`, { signal });
}

export const tipForecastQueryOptions = (assetId: string) =>
  queryOptions({ queryKey: checksKeys.tipForecast(assetId), queryFn: ({ signal }) => getTipForecast(assetId, signal) });

export function useTipForecast(assetId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...tipForecastQueryOptions(assetId), enabled: (options.enabled ?? true) && !!assetId });
}
