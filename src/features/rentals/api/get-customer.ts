import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { CustomerView } from '../../../../shared/billing/views';
import { rentalsKeys } from './keys';

export function getCustomer(id: string, signal?: AbortSignal): Promise<CustomerView> {
  return apiClient.get<CustomerView>(`/customers/${encodeURIComponent(id)}`, { signal });
}

export const customerQueryOptions = (id: string) => queryOptions({ queryKey: rentalsKeys.customer(id), queryFn: ({ signal }) => getCustomer(id, signal) });

export function useCustomer(id: string) {
  return useQuery({ ...customerQueryOptions(id), enabled: !!id });
}
