import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { checksKeys } from './keys';
import type { TipForecastsView } from '../../../../shared/checks/views';

/** Tip positions forecast to reach their limit within the due-soon window, or already past it by their trend. */
export function getForecastsSoon(signal?: AbortSignal): Promise<TipForecastsView> {
  return apiClient.get<TipForecastsView>('/checks/forecasts', { signal });
}

export const forecastsSoonQueryOptions = () => queryOptions({ queryKey: checksKeys.forecastsSoon(), queryFn: ({ signal }) => getForecastsSoon(signal) });

export function useForecastsSoon() {
  return useQuery(forecastsSoonQueryOptions());
}
