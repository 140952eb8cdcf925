import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RevenueRow } from '../../../../shared/billing/views';
import type { Page } from '../../../../shared/lists/page';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';

/** Invoiced revenue per kit per month; `from` and `to` are months YYYY-MM, both included. */
export function getRevenue(range: { from: string; to: string }, signal?: AbortSignal): Promise<Page<RevenueRow>> {
  return apiClient.get<Page<RevenueRow>>('/billing/revenue', { query: range, signal });
}

export const revenueQueryOptions = (range: { from: string; to: string }) =>
  queryOptions({ queryKey: billingKeys.revenue(range), queryFn: ({ signal }) => getRevenue(range, signal) });

export function useRevenue(range: { from: string; to: string }) {
  return useQuery(revenueQueryOptions(range));
}
