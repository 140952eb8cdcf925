import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UtilisationRow } from '../../../../shared/billing/views';
import type { Page } from '../../../../shared/lists/page';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';

/** Booked days against available days per kit; `from` and `to` are dates YYYY-MM-DD, both included. */
export function getUtilisation(range: { from: string; to: string }, signal?: AbortSignal): Promise<Page<UtilisationRow>> {
  return apiClient.get<Page<UtilisationRow>>('/billing/utilisation', { query: range, signal });
}

export const utilisationQueryOptions = (range: { from: string; to: string }) =>
  queryOptions({ queryKey: billingKeys.utilisation(range), queryFn: ({ signal }) => getUtilisation(range, signal) });

export function useUtilisation(range: { from: string; to: string }) {
  return useQuery(utilisationQueryOptions(range));
}
