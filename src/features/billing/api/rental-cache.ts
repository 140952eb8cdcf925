import type { QueryClient } from '@tanstack/react-query';
import { billingKeys } from './keys';
import type { RentalView } from './types';

const refresh = (queryClient: QueryClient, keys: readonly (readonly unknown[])[]) =>
  Promise.all(keys.map((queryKey) => queryClient.invalidateQueries({ queryKey })));

/** After an invoice or credit note: rentals (lists and pages), invoices and the reports refresh (by key prefix). */
export function refreshBilling(queryClient: QueryClient): Promise<unknown> {
  return refresh(queryClient, [billingKeys.rentals(), billingKeys.invoices(), billingKeys.reports()]);
}

/** The server's answer to a change on a rental shows at once on its page; the lists, invoices and reports refresh. */
export function storeRental(queryClient: QueryClient, rental: RentalView): Promise<unknown> {
  queryClient.setQueryData(billingKeys.rental(rental.id), rental);
  return refresh(queryClient, [billingKeys.rentalLists(), billingKeys.invoices(), billingKeys.reports()]);
}

/** A refused payment call may still have changed the deposit (a declined card is kept on record): read the rental again. */
export function reloadRental(queryClient: QueryClient, rentalId: string): Promise<unknown> {
  return queryClient.invalidateQueries({ queryKey: billingKeys.rental(rentalId) });
}
