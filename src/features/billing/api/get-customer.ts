import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { Customer } from './types';

export function getCustomer(id: string, signal?: AbortSignal): Promise<Customer> {
  return apiClient.get<Customer>(`/customers/${encodeURIComponent(id)}`, { signal });
}

export const customerQueryOptions = (id: string) => queryOptions({ queryKey: billingKeys.customer(id), queryFn: ({ signal }) => getCustomer(id, signal) });

export function useCustomer(id: string) {
  return useQuery({ ...customerQueryOptions(id), enabled: !!id });
}
