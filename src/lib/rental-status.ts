import type { QueryClient } from '@tanstack/react-query';

/**
 * Query roots of the rentals and billing features. A rental's deposit, charges
 * and invoices show on its page and in its lists (rentals) and in the invoices
 * and reports (billing), so a change on either side refreshes both; the
 * features own their key factories and start them from these roots.
 */
export const rentalsQueryRoot = ['rentals'] as const;
export const billingQueryRoot = ['billing'] as const;

export function invalidateRentalsAndBilling(queryClient: QueryClient): Promise<unknown> {
  return Promise.all([rentalsQueryRoot, billingQueryRoot].map((queryKey) => queryClient.invalidateQueries({ queryKey })));
}
