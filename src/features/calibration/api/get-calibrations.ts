import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Page } from '../../../../shared/lists/page';
import { calibrationKeys } from './keys';
import type { CalibrationEventView } from '../../../../shared/calibration/views';

export function getCalibrations(assetId: string, signal?: AbortSignal): Promise<Page<CalibrationEventView>> {
  return apiClient.get<Page<CalibrationEventView>>(`/assets/${encodeURIComponent(assetId)}/calibrations`, { signal });
}

/** An item's calibrations, newest first. */
export const calibrationsQueryOptions = (assetId: string) =>
  queryOptions({ queryKey: calibrationKeys.events(assetId), queryFn: ({ signal }) => getCalibrations(assetId, signal) });

export function useCalibrations(assetId: string) {
  return useQuery({ ...calibrationsQueryOptions(assetId), enabled: !!assetId });
}
