import type { Scoped } from '../db/scoped';
import { Customer } from './customer.entity';
import { Rental } from './rental.entity';

/** A rental as other components see it: read-only; billing asks `rememberRentalCard` to keep the card it saved. */
export type RentalRecord = Readonly<Omit<Rental, 'organization' | 'customer' | 'booking'>>;
/** A customer as other components see it: read-only; billing asks `rememberPaymentCustomer` to keep the provider's id. */
export type CustomerRecord = Readonly<Omit<Customer, 'organization'>>;

export const getRental = (tx: Scoped, id: string): Promise<RentalRecord> => tx.get(Rental, { id }, 'That rental');

export const getCustomer = (tx: Scoped, id: string): Promise<CustomerRecord> => tx.get(Customer, { id }, 'That customer');

/** The rental, its row locked until the caller's transaction ends: two clerks (or a clerk and the renewal job) never act on its money at once. */
export async function lockRental(tx: Scoped, id: string): Promise<RentalRecord> {
  await tx.sql(`SELECT id FROM rentals WHERE organization_id = $1 AND id = $2 FOR UPDATE`, [id]);
  return getRental(tx, id);
}

/** The customer's card, saved with the payment provider when the deposit was authorized: renewals and charges above the authorization use it. */
export async function rememberRentalCard(tx: Scoped, rentalId: string, paymentMethodId: string) {
  await tx.updateWhere(Rental, { id: rentalId }, { paymentMethodId });
}

/** The customer's record with the payment provider, made at their first deposit. */
export async function rememberPaymentCustomer(tx: Scoped, customerId: string, paymentCustomerId: string) {
  await tx.updateWhere(Customer, { id: customerId }, { paymentCustomerId });
}
