import { settle, lateDaysBetween } from '../../shared/billing/settlement';
import type { RentalState, RentalView } from '../../shared/billing/views';
import { calendarDayIn } from '../../shared/calibration/due-date';
import { loadBooking, type BookingView } from '../bookings';
import type { Scoped } from '../db/scoped';
import { assetsByIds } from '../fleet';
import { bookingIncidents } from '../incidents/incidents.service';
import { loadOrgContext } from '../organizations';
import type { RentalMoney } from './rental-money';
import { latestAcceptance } from './agreement-acceptance';
import { getCustomer, type RentalRecord } from './rental-records';

const rentalState = (booking: Pick<BookingView, 'state'>, invoiced: boolean): RentalState =>
  booking.state === 'cancelled' ? 'cancelled' : invoiced ? 'invoiced' : booking.state;

/** Everything the rental page shows, read in the caller's transaction; its deposit and invoices as billing tells them. */
export async function loadRentalView(tx: Scoped, rental: RentalRecord, money: RentalMoney): Promise<RentalView> {
  const ctx = await loadOrgContext(tx);
  const booking = await loadBooking(tx, rental.bookingId);
  const customer = await getCustomer(tx, rental.customerId);
  const assets = await assetsByIds(tx, booking.assetIds, { packingOrder: true });
  const incidents = await bookingIncidents(tx, booking.id);
  const { deposit, invoices, moneyMails, depositCapturedMinor, cardChargedMinor } = await money.facts(tx, { id: rental.id, customerCompany: customer.company });
  const returnedOn = booking.returnedAt ? calendarDayIn(new Date(booking.returnedAt), ctx.timeZone) : null;
  const lateDays = booking.state === 'returned' || booking.state === 'out' ? lateDaysBetween(booking.endsOn, returnedOn ?? ctx.today) : 0;
  const charges = incidents.map((i) => ({
    incidentId: i.id,
    assetId: i.assetId,
    assetTag: assets.find((a) => a.id === i.assetId)?.assetTag ?? '',
    kind: i.kind,
    description: i.description,
    amountMinor: i.chargeAmountMinor,
  }));
  return {
    id: rental.id,
    number: rental.number,
    state: rentalState(
      booking,
      invoices.some((i) => i.kind === 'invoice'),
    ),
    customer: { id: customer.id, company: customer.company, billingContact: customer.billingContact, billingEmail: customer.billingEmail },
    bookingId: booking.id,
    kit: booking.kit,
    items: assets.map((a) => ({
      id: a.id,
      assetTag: a.assetTag,
      type: a.type,
      serialNumber: a.serialNumber,
      model: a.model,
      manufacturer: a.manufacturer,
      replacementValueMinor: a.replacementValueMinor,
    })),
    startsOn: booking.startsOn,
    endsOn: booking.endsOn,
    note: rental.note,
    quote: rental.quote,
    currency: rental.currency,
    depositMinor: rental.depositMinor,
    deposit,
    agreement: await latestAcceptance(tx, rental.id),
    handoverOverride:
      rental.handoverOverrideReason && rental.handoverOverrideBy && rental.handoverOverrideAt
        ? { reason: rental.handoverOverrideReason, byUserId: rental.handoverOverrideBy, at: rental.handoverOverrideAt.toISOString() }
        : null,
    checkedOutAt: booking.checkedOutAt,
    returnedAt: booking.returnedAt,
    charges,
    settlement: settle({
      quote: rental.quote,
      lateDays,
      damage: charges
        .filter((c) => c.amountMinor)
        .map((c) => ({ description: `${c.assetTag} — ${c.kind === 'missing' ? 'not returned' : 'damage'}: ${c.description}`, amountMinor: c.amountMinor! })),
      depositCapturedMinor,
      cardChargedMinor,
    }),
    invoices,
    moneyMails,
    createdAt: rental.createdAt.toISOString(),
  };
}
