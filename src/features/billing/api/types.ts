import type { AssetType } from '../../../lib/assets';

export type {
  AuthorizationState,
  DepositAuthorizationView,
  DepositState,
  InvoiceLine,
  InvoiceSummary,
  InvoiceView,
  Quote,
  QuoteLine,
  RentalChargeView,
  RentalItem,
  RentalState,
  RentalSummary,
  RentalView,
  RevenueRow,
  UtilisationRow,
} from '../../../../shared/billing/views';
export type { Periods } from '../../../../shared/billing/quote';

export interface Page<T> {
  items: T[];
  total: number;
}

/** A firm that rents kit (DESIGN.md §3 "Customer"). */
export interface Customer {
  id: string;
  company: string;
  billingContact: string | null;
  billingEmail: string;
  address: string | null;
  taxNumber: string | null;
  notes: string | null;
}
export type CustomerInput = Omit<Customer, 'id'>;

/** Rates for an asset type, or for a whole kit (which then rents as one line). */
export interface RateCard {
  id: string;
  assetType: AssetType | null;
  kitId: string | null;
  dayMinor: number;
  weekMinor: number;
  monthMinor: number;
  lateFeePerDayMinor: number;
}
export type RateCardInput = Omit<RateCard, 'id'>;

/** What a rental is for: a kit and/or separate items, whole days. */
export interface RentalScope {
  kitId?: string;
  assetIds?: string[];
  startsOn: string;
  endsOn: string;
  customerId?: string;
}
export type RentalInput = RentalScope & { customerId: string; note?: string };

export type RentalListView = 'open' | 'to_settle' | 'all';
export type InvoiceKind = 'invoice' | 'credit_note';

/** An item offered for the pickers (GET /assets, a small page of it). */
export interface AssetChoice {
  id: string;
  assetTag: string;
  type: AssetType;
  model: string | null;
  kit: { id: string; name: string } | null;
  status: string;
}
