import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { Page, RentalListView, RentalSummary } from './types';

/** `open`: not cancelled, not yet invoiced; `to_settle`: returned with a hold still authorized or no invoice yet. */
export function getRentals(view: RentalListView, signal?: AbortSignal): Promise<Page<RentalSummary>> {
  return apiClient.get<Page<RentalSummary>>('/rentals', { query: { view, limit: 500, offset: 0 }, signal });
}

export const rentalsQueryOptions = (view: RentalListView) =>
  queryOptions({ queryKey: billingKeys.rentalList(view), queryFn: ({ signal }) => getRentals(view, signal) });

export function useRentals(view: RentalListView) {
  return useQuery(rentalsQueryOptions(view));
}
