import { In } from 'typeorm';
import { settle, lateDaysBetween } from '../../shared/billing/settlement';
import type { DepositHoldView, DepositState, InvoiceSummary, RentalState, RentalView } from '../../shared/billing/views';
import { calendarDayIn } from '../../shared/calibration/due-date';
import { loadBooking, type BookingView } from '../bookings';
import { DepositHold } from '../billing/deposit-hold.entity';
import { Invoice, InvoicePayment } from '../billing/invoice.entity';
import type { Scoped } from '../db/scoped';
import { assetsByIds } from '../fleet';
import { Incident } from '../incidents/incident.entity';
import { loadOrgContext } from '../organizations/org-context';
import { Customer } from './customer.entity';
import type { Rental } from './rental.entity';

export const holdView = (h: DepositHold): DepositHoldView => ({
  id: h.id,
  kind: h.kind,
  state: h.state,
  amountMinor: h.amountMinor,
  capturedMinor: h.capturedMinor,
  cardBrand: h.cardBrand,
  cardLast4: h.cardLast4,
  captureBefore: h.captureBefore?.toISOString() ?? null,
  initiatedBy: h.initiatedBy,
  failureMessage: h.failureMessage,
  captureReason: h.captureReason,
  createdAt: h.createdAt.toISOString(),
  settledAt: h.settledAt?.toISOString() ?? null,
});

/** The deposit's state is its live hold's, else its newest hold's (a replaced hold no longer counts; a refused renewal leaves the live hold standing). */
export function depositState(holds: DepositHold[]): { state: DepositState; hold: DepositHold | null } {
  const candidates = holds.filter((h) => h.kind === 'hold' && h.state !== 'replaced').sort((a, b) => +b.createdAt - +a.createdAt);
  const current = candidates.find((h) => h.state === 'authorized') ?? candidates[0];
  if (!current) return { state: 'none', hold: null };
  return { state: current.state as DepositState, hold: current };
}

/**
 * Invoices of a rental, each with what credit notes took off it and what was
 * received against it; what is outstanding follows from those.
 */
export function invoiceSummaries(invoices: Invoice[], customerCompany: string, payments: Pick<InvoicePayment, 'invoiceId' | 'amountMinor'>[]): InvoiceSummary[] {
  const byId = new Map(invoices.map((i) => [i.id, i]));
  return invoices.map((i) => {
    const credits = invoices.filter((c) => c.correctsInvoiceId === i.id);
    const receivedMinor = payments.filter((p) => p.invoiceId === i.id).reduce((s, p) => s + p.amountMinor, 0);
    return {
      id: i.id,
      kind: i.kind,
      number: i.number,
      issuedOn: i.issuedOn,
      rentalId: i.rentalId,
      customerId: i.customerId,
      customerCompany,
      correctsInvoiceId: i.correctsInvoiceId,
      correctsNumber: i.correctsInvoiceId ? (byId.get(i.correctsInvoiceId)?.number ?? null) : null,
      currency: i.currency,
      subtotalMinor: i.subtotalMinor,
      taxMinor: i.taxMinor,
      totalMinor: i.totalMinor,
      depositCapturedMinor: i.depositCapturedMinor,
      cardChargedMinor: i.cardChargedMinor,
      balanceMinor: i.balanceMinor,
      creditedMinor: credits.reduce((s, c) => s + c.subtotalMinor, 0),
      receivedMinor,
      outstandingMinor: i.kind === 'invoice' ? i.balanceMinor - credits.reduce((s, c) => s + c.totalMinor, 0) - receivedMinor : 0,
      reason: i.reason,
    };
  });
}

export const rentalState = (booking: Pick<BookingView, 'state'>, invoiced: boolean): RentalState => (booking.state === 'cancelled' ? 'cancelled' : invoiced ? 'invoiced' : booking.state);

/** Everything the rental page shows, read in the caller's transaction. */
export async function loadRentalView(tx: Scoped, rental: Rental): Promise<RentalView> {
  const ctx = await loadOrgContext(tx);
  const booking = await loadBooking(tx, rental.bookingId);
  const customer = await tx.get(Customer, { id: rental.customerId }, 'That customer');
  const assets = await assetsByIds(tx, booking.assetIds, { packingOrder: true });
  const holds = await tx.find(DepositHold, { where: { rentalId: rental.id }, order: { createdAt: 'ASC' } });
  const incidents = await tx.find(Incident, { where: { bookingId: booking.id }, order: { createdAt: 'ASC' } });
  const invoices = await tx.find(Invoice, { where: { rentalId: rental.id }, order: { issuedAt: 'ASC' } });
  const deposit = depositState(holds);
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
  const sum = (kind: DepositHold['kind']) => holds.filter((h) => h.kind === kind).reduce((s, h) => s + h.capturedMinor, 0);
  return {
    id: rental.id,
    number: rental.number,
    state: rentalState(booking, invoices.some((i) => i.kind === 'invoice')),
    customer: { id: customer.id, company: customer.company, billingContact: customer.billingContact, billingEmail: customer.billingEmail },
    bookingId: booking.id,
    kit: booking.kit,
    items: assets.map((a) => ({ id: a.id, assetTag: a.assetTag, type: a.type, serialNumber: a.serialNumber, model: a.model, manufacturer: a.manufacturer, replacementValueMinor: a.replacementValueMinor })),
    startsOn: booking.startsOn,
    endsOn: booking.endsOn,
    note: rental.note,
    quote: rental.quote,
    currency: rental.currency,
    depositMinor: rental.depositMinor,
    deposit: { state: deposit.state, hold: deposit.hold ? holdView(deposit.hold) : null, holds: holds.map(holdView) },
    checkedOutAt: booking.checkedOutAt,
    returnedAt: booking.returnedAt,
    charges,
    settlement: settle({
      quote: rental.quote,
      lateDays,
      damage: charges.filter((c) => c.amountMinor).map((c) => ({ description: `${c.assetTag} — ${c.kind === 'missing' ? 'not returned' : 'damage'}: ${c.description}`, amountMinor: c.amountMinor! })),
      depositCapturedMinor: sum('hold'),
      cardChargedMinor: sum('charge'),
    }),
    invoices: invoiceSummaries(invoices, customer.company, await tx.find(InvoicePayment, { where: { invoiceId: In(invoices.map((i) => i.id)) } })),
    createdAt: rental.createdAt.toISOString(),
  };
}
