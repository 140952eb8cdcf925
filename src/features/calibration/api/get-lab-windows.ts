import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { LabWindowsView } from '../../../../shared/calibration/views';

export function getLabWindows(assetId: string, signal?: AbortSignal): Promise<LabWindowsView> {
  return apiClient.get<LabWindowsView>(`/assets/${encodeURIComponent(assetId)}/lab-windows`, { signal });
}

export const labWindowsQueryOptions = (assetId: string) =>
  queryOptions({ queryKey: calibrationKeys.windows(assetId), queryFn: ({ signal }) => getLabWindows(assetId, signal) });

export function useLabWindows(assetId: string) {
  return useQuery({ ...labWindowsQueryOptions(assetId), enabled: !!assetId });
}
