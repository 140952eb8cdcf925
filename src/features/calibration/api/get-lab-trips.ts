import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Page } from '../../../../shared/lists/page';
import { calibrationKeys } from './keys';
import type { LabTripState, LabTripView } from '../../../../shared/calibration/views';

export function getLabTrips(state?: LabTripState, signal?: AbortSignal): Promise<Page<LabTripView>> {
  return apiClient.get<Page<LabTripView>>('/lab-trips', { query: { state }, signal });
}

export const labTripsQueryOptions = (state?: LabTripState) =>
  queryOptions({ queryKey: calibrationKeys.trips(state), queryFn: ({ signal }) => getLabTrips(state, signal) });

export function useLabTrips(state?: LabTripState) {
  return useQuery(labTripsQueryOptions(state));
}
