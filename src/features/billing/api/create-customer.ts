import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { Customer, CustomerInput, Page } from './types';

export function createCustomer(input: CustomerInput): Promise<Customer> {
  return apiClient.post<Customer>('/customers', input);
}

export function useCreateCustomer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCustomer,
    onSuccess: (customer) => {
      // A picker can choose the new customer at once, before the list comes back.
      queryClient.setQueryData<Page<Customer>>(billingKeys.customers(), (page) =>
        page ? { items: [...page.items, customer].sort((a, b) => a.company.localeCompare(b.company)), total: page.total + 1 } : page,
      );
      return queryClient.invalidateQueries({ queryKey: billingKeys.customers() });
    },
  });
}
