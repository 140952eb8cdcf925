import { rentalsQueryRoot } from '../../../lib/rental-status';

/** `open`: not cancelled, not yet invoiced; `to_settle`: returned with a hold still authorized or no invoice yet. */
export type RentalListView = 'open' | 'to_settle' | 'all';

/** What a rental is for: a kit and/or separate items, whole days (the quote prices it for the customer when given). */
export interface RentalScope {
  kitId?: string;
  assetIds?: string[];
  startsOn: string;
  endsOn: string;
  customerId?: string;
}

/** Customers, rate cards, quotes and rentals. */
export const rentalsKeys = {
  all: rentalsQueryRoot,
  customers: () => [...rentalsKeys.all, 'customers'] as const,
  customer: (id: string) => [...rentalsKeys.customers(), 'one', id] as const,
  rateCards: () => [...rentalsKeys.all, 'rate-cards'] as const,
  quote: (scope: RentalScope) => [...rentalsKeys.all, 'quote', scope] as const,
  rentalLists: () => [...rentalsKeys.all, 'list'] as const,
  rentalList: (view: RentalListView, customerId?: string) => [...rentalsKeys.rentalLists(), view, { customerId }] as const,
  rental: (id: string) => [...rentalsKeys.all, 'one', id] as const,
  renter: (token: string) => [...rentalsKeys.all, 'renter', token] as const,
};
