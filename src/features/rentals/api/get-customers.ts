import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { CustomerView } from '../../../../shared/billing/views';
import type { Page } from '../../../../shared/lists/page';
import { rentalsKeys } from './keys';

/** Every customer of the firm, by company name (the API's largest page). */
export function getCustomers(signal?: AbortSignal): Promise<Page<CustomerView>> {
  return apiClient.get<Page<CustomerView>>('/customers', { query: { limit: 500, offset: 0 }, signal });
}

export const customersQueryOptions = () => queryOptions({ queryKey: rentalsKeys.customers(), queryFn: ({ signal }) => getCustomers(signal) });

export function useCustomers() {
  return useQuery(customersQueryOptions());
}
