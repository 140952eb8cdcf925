import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { CustomerView } from '../../../../shared/billing/views';
import type { Page } from '../../../../shared/lists/page';
import { rentalsKeys } from './keys';

/** What the customer form sends (POST and PUT /api/customers). */
export type CustomerInput = Omit<CustomerView, 'id'>;

export function createCustomer(input: CustomerInput): Promise<CustomerView> {
  return apiClient.post<CustomerView>('/customers', input);
}

export function useCreateCustomer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCustomer,
    onSuccess: (customer) => {
      // A picker can choose the new customer at once, before the list comes back.
      queryClient.setQueryData<Page<CustomerView>>(rentalsKeys.customers(), (page) =>
        page ? { items: [...page.items, customer].sort((a, b) => a.company.localeCompare(b.company)), total: page.total + 1 } : page,
      );
      return queryClient.invalidateQueries({ queryKey: rentalsKeys.customers() });
    },
  });
}
