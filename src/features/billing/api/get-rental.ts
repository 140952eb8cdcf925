import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, apiUrl } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { RentalView } from './types';

export function getRental(id: string, signal?: AbortSignal): Promise<RentalView> {
  return apiClient.get<RentalView>(`/rentals/${encodeURIComponent(id)}`, { signal });
}

export const rentalQueryOptions = (id: string) => queryOptions({ queryKey: billingKeys.rental(id), queryFn: ({ signal }) => getRental(id, signal) });

export function useRental(id: string) {
  return useQuery({ ...rentalQueryOptions(id), enabled: !!id });
}

/** The rental's documents (same-origin links; the session cookie goes with them). */
export const rentalDocumentUrl = (id: string, document: 'agreement' | 'certificate-pack' | 'invoice') =>
  apiUrl(`/rentals/${encodeURIComponent(id)}/${document}.pdf`);
