/**
 * Rentals' surface for other components. Rentals own customers, rate cards
 * and rentals: others read them as plain records and ask here to change the
 * two fields the payment side keeps on them. A rental's money is billing's,
 * learned through the `RentalMoney` answer app.ts hands in.
 */
export { getCustomer, getRental, lockRental, rememberPaymentCustomer, rememberRentalCard, type CustomerRecord, type RentalRecord } from './rental-records';
export type { RentalMoney, RentalMoneyFacts } from './rental-money';
export { loadRentalView } from './rental-view';
export { issueRenterLink, RENTER_LINK_DAYS } from './renter-links';
