import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { CalibrationEvent } from './types';

export function getCalibrations(assetId: string, signal?: AbortSignal): Promise<{ items: CalibrationEvent[] }> {
  return apiClient.get<{ items: CalibrationEvent[] }>(`/assets/${encodeURIComponent(assetId)}/calibrations`, { signal });
}

/** An item's calibrations, newest first. */
export const calibrationsQueryOptions = (assetId: string) =>
  queryOptions({ queryKey: calibrationKeys.events(assetId), queryFn: ({ signal }) => getCalibrations(assetId, signal) });

export function useCalibrations(assetId: string) {
  return useQuery({ ...calibrationsQueryOptions(assetId), enabled: !!assetId });
}
