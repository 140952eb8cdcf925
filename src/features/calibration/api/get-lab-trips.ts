import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { LabTrip, LabTripState } from './types';

export function getLabTrips(state?: LabTripState, signal?: AbortSignal): Promise<{ items: LabTrip[] }> {
  return apiClient.get<{ items: LabTrip[] }>('/lab-trips', { query: { state }, signal });
}

export const labTripsQueryOptions = (state?: LabTripState) =>
  queryOptions({ queryKey: calibrationKeys.trips(state), queryFn: ({ signal }) => getLabTrips(state, signal) });

export function useLabTrips(state?: LabTripState) {
  return useQuery(labTripsQueryOptions(state));
}
