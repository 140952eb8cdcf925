import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { LabWindowsView } from '../../../../shared/calibration/views';

/** One window free for every item of one lab trip. */
export function getTripWindows(assetIds: string[], signal?: AbortSignal): Promise<LabWindowsView> {
  return apiClient.get<LabWindowsView>(`/lab-windows?assetIds=${assetIds.map(encodeURIComponent).join(',')}`, { signal });
}

export const tripWindowsQueryOptions = (assetIds: string[]) =>
  queryOptions({ queryKey: calibrationKeys.tripWindows(assetIds), queryFn: ({ signal }) => getTripWindows(assetIds, signal) });

export function useTripWindows(assetIds: string[]) {
  return useQuery({ ...tripWindowsQueryOptions(assetIds), enabled: assetIds.length > 0 });
}
