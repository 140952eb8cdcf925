import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import { formatMoney } from '../../shared/billing/money';
import type { capturePayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { loadBooking, type BookingView } from '../bookings';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { AppError, conflict, ruleBroken } from '../http/errors';
import { Customer } from '../rentals/customer.entity';
import { depositState, loadRentalView } from '../rentals/rental-view';
import { Rental } from '../rentals/rental.entity';
import { DepositHold } from './deposit-hold.entity';
import { Invoice } from './invoice.entity';
import type { IntentOutcome, PaymentGateway } from './payment-gateway';

/** Locks the rental row so two clerks (or a clerk and the renewal job) never act on one deposit at once. */
export async function lockRental(tx: Scoped, id: string): Promise<Rental> {
  await tx.sql(`SELECT id FROM rentals WHERE organization_id = $1 AND id = $2 FOR UPDATE`, [id]);
  return tx.get(Rental, { id }, 'That rental');
}

const money = (rental: Rental, minor: number) => formatMoney(minor, rental.currency, 'en-GB');

/**
 * Deposit holds through the provider: authorize at checkout, capture damage
 * and late charges at return (the rest released), charge the saved card for
 * anything above the hold, release, renew before the hold lapses. Every
 * provider call carries a key derived from the operation and the hold it acts
 * on, so a retry replays instead of charging again.
 */
export class DepositsService {
  constructor(
    private readonly db: DataSource,
    private readonly gateway: PaymentGateway,
  ) {}

  async authorize(actor: Actor, rentalId: string, paymentMethod: string) {
    const result = await inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await lockRental(tx, rentalId);
      const booking = await loadBooking(tx, rental.bookingId);
      // Before handing over — or again while out, should a hold have lapsed.
      if (booking.state !== 'reserved' && booking.state !== 'out') throw ruleBroken('booking_state', `The deposit is taken before handing over; this rental is ${booking.state}.`);
      if (rental.depositMinor <= 0) throw ruleBroken('no_deposit', 'This rental has no deposit to hold (the firm’s deposit policy gave nothing).');
      const holds = await tx.find(DepositHold, { where: { rentalId } });
      if (depositState(holds).state === 'authorized') throw conflict(`A hold of ${money(rental, rental.depositMinor)} is already on the card.`);
      const customer = await this.providerCustomer(tx, rental.customerId);
      const key = `rental:${rental.id}:hold:${holds.length + 1}`;
      const card = await this.gateway.saveCard(paymentMethod, customer, `${key}:card`);
      const outcome = await this.gateway.confirmIntent({
        amountMinor: rental.depositMinor,
        currency: rental.currency,
        customer,
        paymentMethod: card,
        capture: 'manual',
        offSession: false,
        description: `Deposit for rental ${rental.number}`,
        metadata: { rentalId: rental.id, organizationId: actor.organizationId, purpose: 'deposit' },
        key,
      });
      await this.record(tx, rental, { kind: 'hold', key, amountMinor: rental.depositMinor, initiatedBy: 'customer', outcome });
      if (outcome.ok) {
        rental.paymentMethodId = card;
        await tx.save(Rental, rental);
      }
      await recordAudit(tx, actor, outcome.ok ? 'deposit.authorized' : 'deposit.declined', { type: 'rental', id: rentalId }, { amountMinor: rental.depositMinor, message: outcome.ok ? null : outcome.message });
      return { view: await loadRentalView(tx, rental), declined: outcome.ok ? null : outcome.message };
    });
    // The declined attempt stays on record (committed above); the clerk is told why.
    if (result.declined) throw new AppError(422, 'card_declined', `The card was declined: ${result.declined} Checkout stays blocked until a hold is in place; try another card.`, { rental: result.view });
    return result.view;
  }

  /**
   * Takes `amountMinor` at return: from the hold first (the provider releases
   * what is not captured), the rest as a charge on the saved card. Without a
   * live hold (it lapsed or was released) the whole amount goes on the card.
   */
  capture(actor: Actor, rentalId: string, input: z.infer<typeof capturePayload>) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await lockRental(tx, rentalId);
      await this.assertSettleable(tx, rental);
      const { state, hold } = depositState(await tx.find(DepositHold, { where: { rentalId } }));
      // Once captured, a repeat (a double click, a retry after an error page) must not reach the card.
      if (state === 'captured') throw conflict(`The hold was already captured (${money(rental, hold!.capturedMinor)}); anything further goes on the invoice.`);
      let fromHold = 0;
      if (state === 'authorized' && hold?.paymentIntentId) fromHold = await this.captureHold(tx, hold, rental.currency, Math.min(input.amountMinor, hold.amountMinor), input.reason);
      const above = input.amountMinor - fromHold;
      if (above > 0) await this.chargeCard(tx, rental, above, input.reason, hold);
      await recordAudit(tx, actor, 'deposit.captured', { type: 'rental', id: rentalId }, { amountMinor: input.amountMinor, fromHoldMinor: fromHold, chargedMinor: above, reason: input.reason });
      return loadRentalView(tx, rental);
    });
  }

  release(actor: Actor, rentalId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await lockRental(tx, rentalId);
      const { state, hold } = depositState(await tx.find(DepositHold, { where: { rentalId } }));
      if (state !== 'authorized' || !hold?.paymentIntentId) throw ruleBroken('no_hold', 'There is no hold on the card to release.');
      const booking = await loadBooking(tx, rental.bookingId);
      if (booking.state === 'out') throw ruleBroken('booking_state', 'The kit is still out: release the hold at return.');
      await this.gateway.cancel(hold.paymentIntentId, `hold:${hold.id}:release`);
      Object.assign(hold, { state: 'released', settledAt: new Date() });
      await tx.save(DepositHold, hold);
      await recordAudit(tx, actor, 'deposit.released', { type: 'rental', id: rentalId }, { amountMinor: hold.amountMinor });
      return loadRentalView(tx, rental);
    });
  }

  /** A cancelled rental keeps nothing on the customer's card: its live hold is released with the booking. */
  async releaseForCancelledBooking(tx: Scoped, booking: Pick<BookingView, 'rentalId'>) {
    if (!booking.rentalId) return;
    const rental = await lockRental(tx, booking.rentalId);
    const { state, hold } = depositState(await tx.find(DepositHold, { where: { rentalId: rental.id } }));
    if (state !== 'authorized' || !hold?.paymentIntentId) return;
    await this.gateway.cancel(hold.paymentIntentId, `hold:${hold.id}:release`);
    Object.assign(hold, { state: 'released', settledAt: new Date() });
    await tx.save(DepositHold, hold);
  }

  /**
   * Places a fresh hold on the saved card (merchant-initiated, so the card
   * network's shorter window applies) and lets the old one go. Returns the
   * failure in words when the card will not take it.
   */
  async renew(tx: Scoped, rental: Rental, hold: DepositHold, day: string): Promise<{ ok: true } | { ok: false; message: string }> {
    const customer = await this.providerCustomer(tx, rental.customerId);
    if (!rental.paymentMethodId) return { ok: false, message: 'no card is saved for this rental' };
    const key = `hold:${hold.id}:renewal:${day}`;
    const outcome = await this.gateway.confirmIntent({
      amountMinor: hold.amountMinor,
      currency: rental.currency,
      customer,
      paymentMethod: rental.paymentMethodId,
      capture: 'manual',
      offSession: true,
      description: `Deposit for rental ${rental.number} (renewed)`,
      metadata: { rentalId: rental.id, organizationId: tx.organizationId, purpose: 'deposit', renews: hold.id },
      key,
    });
    await this.record(tx, rental, { kind: 'hold', key, amountMinor: hold.amountMinor, initiatedBy: 'merchant', outcome });
    if (!outcome.ok) return { ok: false, message: outcome.message };
    await this.gateway.cancel(hold.paymentIntentId!, `hold:${hold.id}:release`);
    Object.assign(hold, { state: 'replaced', settledAt: new Date() });
    await tx.save(DepositHold, hold);
    return { ok: true };
  }

  /**
   * Captures from the hold and returns what it took. A hold that lapsed at the
   * provider before its event reached us is recorded as lapsed and takes
   * nothing, so the whole amount goes on the card instead.
   */
  private async captureHold(tx: Scoped, hold: DepositHold, currency: string, amountMinor: number, reason: string): Promise<number> {
    try {
      const captured = await this.gateway.capture(hold.paymentIntentId!, amountMinor, currency, `hold:${hold.id}:capture`);
      Object.assign(hold, { state: 'captured', capturedMinor: captured.ok ? captured.capturedMinor : amountMinor, captureReason: reason, settledAt: new Date() });
      await tx.save(DepositHold, hold);
      return amountMinor;
    } catch (err) {
      if (!(err instanceof AppError && err.code === 'payment_refused') || (await this.gateway.retrieve(hold.paymentIntentId!)).status !== 'canceled') throw err;
      Object.assign(hold, { state: 'lapsed', settledAt: new Date() });
      await tx.save(DepositHold, hold);
      return 0;
    }
  }

  private async assertSettleable(tx: Scoped, rental: Rental) {
    const booking = await loadBooking(tx, rental.bookingId);
    if (booking.state !== 'returned') throw ruleBroken('booking_state', `Charges are taken at return; this rental is ${booking.state}.`);
    if (await tx.count(Invoice, { rentalId: rental.id, kind: 'invoice' })) throw ruleBroken('already_invoiced', `Rental ${rental.number} is invoiced; correct it with a credit note.`);
  }

  /** Charges the saved card at once (merchant-initiated); a decline is recorded and reported. */
  private async chargeCard(tx: Scoped, rental: Rental, amountMinor: number, reason: string, hold: DepositHold | null) {
    if (!rental.paymentMethodId) throw ruleBroken('no_card', `No card is saved for rental ${rental.number}: put ${money(rental, amountMinor)} on the invoice instead.`);
    const charges = await tx.count(DepositHold, { rentalId: rental.id, kind: 'charge' });
    const key = `rental:${rental.id}:charge:${hold?.id ?? 'card'}:${charges + 1}`;
    const outcome = await this.gateway.confirmIntent({
      amountMinor,
      currency: rental.currency,
      customer: await this.providerCustomer(tx, rental.customerId),
      paymentMethod: rental.paymentMethodId,
      capture: 'automatic',
      offSession: true,
      description: `Rental ${rental.number}: ${reason}`,
      metadata: { rentalId: rental.id, organizationId: tx.organizationId, purpose: 'charge' },
      key,
    });
    await this.record(tx, rental, { kind: 'charge', key, amountMinor, initiatedBy: 'merchant', outcome, reason });
  }

  private async record(tx: Scoped, rental: Rental, r: { kind: DepositHold['kind']; key: string; amountMinor: number; initiatedBy: DepositHold['initiatedBy']; outcome: IntentOutcome; reason?: string }) {
    const o = r.outcome;
    const existing = await tx.findOne(DepositHold, { idempotencyKey: r.key });
    if (existing) return existing; // a replayed request: already on record
    return tx.insert(DepositHold, {
      rentalId: rental.id,
      kind: r.kind,
      paymentIntentId: o.id,
      idempotencyKey: r.key,
      state: !o.ok ? 'declined' : r.kind === 'charge' ? 'captured' : 'authorized',
      amountMinor: r.amountMinor,
      capturedMinor: o.ok && r.kind === 'charge' ? o.capturedMinor : 0,
      cardBrand: o.ok ? o.cardBrand : null,
      cardLast4: o.ok ? o.cardLast4 : null,
      captureBefore: o.ok && r.kind === 'hold' ? o.captureBefore : null,
      initiatedBy: r.initiatedBy,
      failureMessage: o.ok ? null : o.message,
      captureReason: r.reason ?? null,
      settledAt: r.kind === 'charge' || !o.ok ? new Date() : null,
    });
  }

  private async providerCustomer(tx: Scoped, customerId: string): Promise<string> {
    const customer = await tx.get(Customer, { id: customerId }, 'That customer');
    if (customer.paymentCustomerId) return customer.paymentCustomerId;
    customer.paymentCustomerId = await this.gateway.ensureCustomer(customer);
    await tx.save(Customer, customer);
    return customer.paymentCustomerId;
  }
}
