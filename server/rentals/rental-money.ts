import type { DepositState, RentalView } from '../../shared/billing/views';
import type { Scoped } from '../db/scoped';

/** A rental's money as billing keeps it, in plain values: its deposit (card authorizations and charges) and invoices. */
export type RentalMoneyFacts = Pick<RentalView, 'deposit' | 'invoices' | 'moneyMails'> & {
  /** Taken from the deposit's card authorization. */
  depositCapturedMinor: number;
  /** Charged to the saved card above the authorization. */
  cardChargedMinor: number;
};

/**
 * What rentals ask billing about a rental's money. Billing answers it
 * (billing/rental-money.ts) and app.ts hands the answer in, so rentals import
 * nothing of billing while billing builds on rentals' surface.
 */
export type RentalMoney = {
  /** The deposit's state alone: the counter's gate and repricing. */
  depositState(tx: Scoped, rentalId: string): Promise<DepositState>;
  /** True once the rental's invoice is issued: its charges are then corrected by credit note only. */
  invoiced(tx: Scoped, rentalId: string): Promise<boolean>;
  /** Everything the rental page shows of its deposit and invoices. */
  facts(tx: Scoped, rental: { id: string; customerCompany: string }): Promise<RentalMoneyFacts>;
};
