import type { QueryClient } from '@tanstack/react-query';
import type { RentalView } from '../../../../shared/billing/views';
import { billingQueryRoot } from '../../../lib/rental-status';
import { rentalsKeys } from './keys';

/** The server's answer to a change on a rental shows at once on its page; the rental lists, invoices and reports refresh. */
export function storeRental(queryClient: QueryClient, rental: RentalView): Promise<unknown> {
  queryClient.setQueryData(rentalsKeys.rental(rental.id), rental);
  return Promise.all([rentalsKeys.rentalLists(), billingQueryRoot].map((queryKey) => queryClient.invalidateQueries({ queryKey })));
}
