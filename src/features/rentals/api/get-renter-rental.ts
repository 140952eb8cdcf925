import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RenterRentalView } from '../../../../shared/billing/views';
import { apiClient, apiUrl } from '../../../lib/api-client';
import { rentalsKeys } from './keys';

const path = (token: string) => `/renter/${encodeURIComponent(token)}`;

export function getRenterRental(token: string, signal?: AbortSignal): Promise<RenterRentalView> {
  return apiClient.get<RenterRentalView>(path(token), { signal });
}

export const renterRentalQueryOptions = (token: string) =>
  queryOptions({ queryKey: rentalsKeys.renter(token), queryFn: ({ signal }) => getRenterRental(token, signal), retry: false });

/** The renter's page; asked again every few seconds while the provider has yet to confirm their card. */
export function useRenterRental(token: string) {
  return useQuery({
    ...renterRentalQueryOptions(token),
    refetchInterval: (query) => (query.state.data?.deposit.request?.state === 'waiting' && query.state.data.deposit.state !== 'authorized' ? 3000 : false),
  });
}

export const renterDocumentUrl = (token: string, document: 'agreement' | 'certificate-pack') => apiUrl(`${path(token)}/${document}.pdf`);
