import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, apiUrl } from '../../../lib/api-client';
import type { RentalView } from '../../../../shared/billing/views';
import { rentalsKeys } from './keys';

export function getRental(id: string, signal?: AbortSignal): Promise<RentalView> {
  return apiClient.get<RentalView>(`/rentals/${encodeURIComponent(id)}`, { signal });
}

export const rentalQueryOptions = (id: string) => queryOptions({ queryKey: rentalsKeys.rental(id), queryFn: ({ signal }) => getRental(id, signal) });

export function useRental(id: string) {
  return useQuery({ ...rentalQueryOptions(id), enabled: !!id });
}

/** The rental's documents (same-origin links; the session cookie goes with them). */
export const rentalDocumentUrl = (id: string, document: 'agreement' | 'certificate-pack') => apiUrl(`/rentals/${encodeURIComponent(id)}/${document}.pdf`);
