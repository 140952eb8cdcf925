import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { CustomerView } from '../../../../shared/billing/views';
import { invalidateRentalsAndBilling } from '../../../lib/rental-status';
import type { CustomerInput } from './create-customer';
import { rentalsKeys } from './keys';

export function updateCustomer({ id, ...input }: CustomerInput & { id: string }): Promise<CustomerView> {
  return apiClient.put<CustomerView>(`/customers/${encodeURIComponent(id)}`, input);
}

export function useUpdateCustomer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateCustomer,
    // The customer's page shows the answer at once; rentals and invoices show the company: both refresh.
    onSuccess: (customer) => {
      queryClient.setQueryData(rentalsKeys.customer(customer.id), customer);
      return invalidateRentalsAndBilling(queryClient);
    },
  });
}
