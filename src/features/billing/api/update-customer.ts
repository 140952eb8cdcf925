import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { Customer, CustomerInput } from './types';

export function updateCustomer({ id, ...input }: CustomerInput & { id: string }): Promise<Customer> {
  return apiClient.put<Customer>(`/customers/${encodeURIComponent(id)}`, input);
}

export function useUpdateCustomer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateCustomer,
    // The customer's page shows the answer at once; rentals and invoices show the company: everything billing refreshes.
    onSuccess: (customer) => {
      queryClient.setQueryData(billingKeys.customer(customer.id), customer);
      return queryClient.invalidateQueries({ queryKey: billingKeys.all });
    },
  });
}
