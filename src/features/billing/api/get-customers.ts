import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { Customer, Page } from './types';

/** Every customer of the firm, by company name (the API's largest page). */
export function getCustomers(signal?: AbortSignal): Promise<Page<Customer>> {
  return apiClient.get<Page<Customer>>('/customers', { query: { limit: 500, offset: 0 }, signal });
}

export const customersQueryOptions = () => queryOptions({ queryKey: billingKeys.customers(), queryFn: ({ signal }) => getCustomers(signal) });

export function useCustomers() {
  return useQuery(customersQueryOptions());
}
