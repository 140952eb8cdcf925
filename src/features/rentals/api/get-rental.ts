import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, apiUrl } from '../../../lib/api-client';
import type { RentalView } from '../../../../shared/billing/views';
import { rentalsKeys } from './keys';

export function getRental(id: string, signal?: AbortSignal): Promise<RentalView> {
  return apiClient.get<RentalView>(`/rentals/${encodeURIComponent(id)}`, { signal });
}

export const rentalQueryOptions = (id: string) => queryOptions({ queryKey: rentalsKeys.rental(id), queryFn: ({ signal }) => getRental(id, signal) });

/** How often a rental is asked again while `pollWhile` says something outside the app will change it. */
const POLL_MS = 3000;

/** `pollWhile`: the renter is at the provider's page, say; the page follows the signed event without a reload. */
export function useRental(id: string, pollWhile?: (rental: RentalView) => boolean) {
  return useQuery({
    ...rentalQueryOptions(id),
    enabled: !!id,
    refetchInterval: (query) => (pollWhile && query.state.data && pollWhile(query.state.data) ? POLL_MS : false),
  });
}

/** The rental's documents (same-origin links; the session cookie goes with them). */
export const rentalDocumentUrl = (id: string, document: 'agreement' | 'certificate-pack') => apiUrl(`/rentals/${encodeURIComponent(id)}/${document}.pdf`);
