import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { RentalSummary } from '../../../../shared/billing/views';
import type { Page } from '../../../../shared/lists/page';
import { rentalsKeys, type RentalListView } from './keys';

/** `open`: not cancelled, not yet invoiced; `to_settle`: returned with a hold still authorized or no invoice yet. Without a customer, every customer's. */
export function getRentals(view: RentalListView, customerId?: string, signal?: AbortSignal): Promise<Page<RentalSummary>> {
  return apiClient.get<Page<RentalSummary>>('/rentals', { query: { view, customerId, limit: 500, offset: 0 }, signal });
}

export const rentalsQueryOptions = (view: RentalListView, customerId?: string) =>
  queryOptions({ queryKey: rentalsKeys.rentalList(view, customerId), queryFn: ({ signal }) => getRentals(view, customerId, signal) });

export function useRentals(view: RentalListView, customerId?: string) {
  return useQuery(rentalsQueryOptions(view, customerId));
}
