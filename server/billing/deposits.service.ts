import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import { captureSplit } from '../../shared/billing/settlement';
import { firmFormat } from '../../shared/formatting/firm-format';
import type { capturePayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { loadBooking, type BookingView } from '../bookings';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { AppError, conflict, ruleBroken } from '../http/errors';
import { loadOrgContext, voiceOf } from '../organizations';
import { getCustomer, loadRentalView, lockRental, rememberRentalCard, type RentalRecord } from '../rentals';
import { depositSettledMail } from './billing-mail';
import { mailCustomerAbout } from './money-mails';
import { providerCustomer } from './provider-customer';
import { DepositAuthorization } from './deposit-authorization.entity';
import { depositState } from './deposit-state';
import { Invoice } from './invoice.entity';
import type { IntentOutcome, PaymentGateway } from './payment-gateway';
import { rentalMoney } from './rental-money';

/** An amount of the rental's money as the firm writes it (refusals speak as the screens do). */
async function moneyOf(tx: Scoped, rental: RentalRecord) {
  const ctx = await loadOrgContext(tx);
  return (minor: number) => firmFormat(voiceOf(ctx)).money(minor, rental.currency);
}

/**
 * Deposits as card authorizations through the provider: authorize at
 * checkout, capture damage and late charges at return (the rest released),
 * charge the saved card for anything above the authorization, release, renew
 * before it lapses. Every provider call carries a key derived from the
 * operation and the authorization it acts on, so a retry replays instead of
 * charging again. (The keys still read `hold`: they are stored and replayed,
 * so they keep the spelling the provider has already seen.)
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
      // Before handing over — or again while out, should the authorization have lapsed.
      if (booking.state !== 'reserved' && booking.state !== 'out')
        throw ruleBroken('booking_state', `The deposit is taken before handing over; this rental is ${booking.state}.`);
      if (rental.depositMinor <= 0) throw ruleBroken('no_deposit', 'This rental has no deposit to authorize (the firm’s deposit policy gave nothing).');
      const rows = await tx.find(DepositAuthorization, { where: { rentalId } });
      if (depositState(rows).state === 'authorized') throw conflict(`The card is already authorized for ${(await moneyOf(tx, rental))(rental.depositMinor)}.`);
      const customer = await providerCustomer(tx, this.gateway, rental.customerId);
      const key = `rental:${rental.id}:hold:${rows.length + 1}`;
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
      await this.record(tx, rental, { kind: 'authorization', key, amountMinor: rental.depositMinor, initiatedBy: 'customer', outcome });
      if (outcome.ok) await rememberRentalCard(tx, rental.id, card);
      await recordAudit(
        tx,
        actor,
        outcome.ok ? 'deposit.authorized' : 'deposit.declined',
        { type: 'rental', id: rentalId },
        { amountMinor: rental.depositMinor, message: outcome.ok ? null : outcome.message },
      );
      return { view: await loadRentalView(tx, rental, rentalMoney), declined: outcome.ok ? null : outcome.message };
    });
    // The declined attempt stays on record (committed above); the clerk is told why.
    if (result.declined)
      throw new AppError(
        422,
        'card_declined',
        `The card was declined (“${result.declined.replace(/\.$/, '')}”). Checkout stays blocked until the deposit is authorized; try another card.`,
        { rental: result.view },
      );
    return result.view;
  }

  /**
   * Takes `amountMinor` at return: from the authorization first (the provider
   * releases what is not captured), the rest as a charge on the saved card.
   * Without a live authorization (it lapsed or was released) the whole amount
   * goes on the card.
   */
  async capture(actor: Actor, rentalId: string, input: z.infer<typeof capturePayload>) {
    const result = await inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await lockRental(tx, rentalId);
      await this.assertSettleable(tx, rental);
      const { state, authorization } = depositState(await tx.find(DepositAuthorization, { where: { rentalId } }));
      // Once captured, a repeat (a double click, a retry after an error page) must not reach the card.
      if (state === 'captured')
        throw conflict(
          `The deposit was already captured (${(await moneyOf(tx, rental))(authorization!.capturedMinor)}); anything further goes on the invoice.`,
        );
      const live = state === 'authorized' && authorization?.paymentIntentId ? authorization : null;
      // The same split the clerk's confirmation showed (shared/billing/settlement.ts).
      const split = captureSplit(input.amountMinor, live?.amountMinor ?? 0);
      const fromAuthorization = live ? await this.captureAuthorization(tx, live, rental.currency, split.fromAuthorizationMinor, input.reason) : 0;
      const released = fromAuthorization ? split.releasedMinor : 0;
      const above = input.amountMinor - fromAuthorization;
      const charge = above > 0 ? await this.chargeCard(tx, rental, above, input.reason, authorization) : null;
      const charged = charge?.state === 'captured' ? charge.capturedMinor : 0;
      await recordAudit(
        tx,
        actor,
        'deposit.captured',
        { type: 'rental', id: rentalId },
        { amountMinor: input.amountMinor, fromAuthorizationMinor: fromAuthorization, chargedMinor: charged, reason: input.reason },
      );
      if (fromAuthorization || charged)
        await this.mailSettlement(tx, rental, { capturedMinor: fromAuthorization, releasedMinor: released, chargedMinor: charged }, input.reason);
      const declined = charge && charge.state === 'declined' ? { amountMinor: above, message: charge.failureMessage ?? '' } : null;
      return { view: await loadRentalView(tx, rental, rentalMoney), declined, capturedMinor: fromAuthorization, money: await moneyOf(tx, rental) };
    });
    // What was captured stays captured (committed above); the clerk is told once that the card refused the rest.
    if (result.declined)
      throw new AppError(
        422,
        'card_declined',
        `The saved card declined the charge of ${result.money(result.declined.amountMinor)}: ${result.declined.message}${
          result.capturedMinor ? ` ${result.money(result.capturedMinor)} was captured from the authorization.` : ''
        } Put the rest on the invoice.`,
        { rental: result.view },
      );
    return result.view;
  }

  release(actor: Actor, rentalId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await lockRental(tx, rentalId);
      const { state, authorization } = depositState(await tx.find(DepositAuthorization, { where: { rentalId } }));
      if (state !== 'authorized' || !authorization?.paymentIntentId) throw ruleBroken('no_authorization', 'No deposit is authorized on the card to release.');
      const booking = await loadBooking(tx, rental.bookingId);
      if (booking.state === 'out') throw ruleBroken('booking_state', 'The kit is still out: release the deposit at return.');
      await this.gateway.cancel(authorization.paymentIntentId, `hold:${authorization.id}:release`);
      Object.assign(authorization, { state: 'released', settledAt: new Date() });
      await tx.save(DepositAuthorization, authorization);
      await recordAudit(tx, actor, 'deposit.released', { type: 'rental', id: rentalId }, { amountMinor: authorization.amountMinor });
      await this.mailSettlement(tx, rental, { capturedMinor: 0, releasedMinor: authorization.amountMinor, chargedMinor: 0 }, null);
      return loadRentalView(tx, rental, rentalMoney);
    });
  }

  /** Tells the customer's billing contact what was taken from their card and what was let go. */
  private async mailSettlement(
    tx: Scoped,
    rental: RentalRecord,
    told: { capturedMinor: number; releasedMinor: number; chargedMinor: number },
    reason: string | null,
  ) {
    const customer = await getCustomer(tx, rental.customerId);
    const takenMinor = told.capturedMinor + told.chargedMinor;
    await mailCustomerAbout(tx, rental.id, takenMinor ? 'deposit_captured' : 'deposit_released', told, customer.billingEmail, depositSettledMail, {
      rental,
      customer,
      ...told,
      takenMinor,
      reason,
    });
  }

  /** A cancelled rental keeps nothing on the customer's card: its live authorization is released with the booking. */
  async releaseForCancelledBooking(tx: Scoped, booking: Pick<BookingView, 'rentalId'>) {
    if (!booking.rentalId) return;
    const rental = await lockRental(tx, booking.rentalId);
    const { state, authorization } = depositState(await tx.find(DepositAuthorization, { where: { rentalId: rental.id } }));
    if (state !== 'authorized' || !authorization?.paymentIntentId) return;
    await this.gateway.cancel(authorization.paymentIntentId, `hold:${authorization.id}:release`);
    Object.assign(authorization, { state: 'released', settledAt: new Date() });
    await tx.save(DepositAuthorization, authorization);
  }

  /**
   * Authorizes the card afresh (merchant-initiated on the saved card, so the
   * card network's shorter window applies) and lets the old authorization go.
   * Returns the failure in words when the card will not take it.
   */
  async renew(tx: Scoped, rental: RentalRecord, authorization: DepositAuthorization, day: string): Promise<{ ok: true } | { ok: false; message: string }> {
    const customer = await providerCustomer(tx, this.gateway, rental.customerId);
    if (!rental.paymentMethodId) return { ok: false, message: 'no card is saved for this rental' };
    const key = `hold:${authorization.id}:renewal:${day}`;
    const outcome = await this.gateway.confirmIntent({
      amountMinor: authorization.amountMinor,
      currency: rental.currency,
      customer,
      paymentMethod: rental.paymentMethodId,
      capture: 'manual',
      offSession: true,
      description: `Deposit for rental ${rental.number} (renewed)`,
      metadata: { rentalId: rental.id, organizationId: tx.organizationId, purpose: 'deposit', renews: authorization.id },
      key,
    });
    await this.record(tx, rental, { kind: 'authorization', key, amountMinor: authorization.amountMinor, initiatedBy: 'merchant', outcome });
    if (!outcome.ok) return { ok: false, message: outcome.message };
    await this.gateway.cancel(authorization.paymentIntentId!, `hold:${authorization.id}:release`);
    Object.assign(authorization, { state: 'replaced', settledAt: new Date() });
    await tx.save(DepositAuthorization, authorization);
    return { ok: true };
  }

  /**
   * Captures from the authorization and returns what it took. One that lapsed
   * at the provider before its event reached us is recorded as lapsed and
   * takes nothing, so the whole amount goes on the card instead.
   */
  private async captureAuthorization(tx: Scoped, authorization: DepositAuthorization, currency: string, amountMinor: number, reason: string): Promise<number> {
    try {
      const captured = await this.gateway.capture(authorization.paymentIntentId!, amountMinor, currency, `hold:${authorization.id}:capture`);
      Object.assign(authorization, {
        state: 'captured',
        capturedMinor: captured.ok ? captured.capturedMinor : amountMinor,
        captureReason: reason,
        settledAt: new Date(),
      });
      await tx.save(DepositAuthorization, authorization);
      return amountMinor;
    } catch (err) {
      if (!(err instanceof AppError && err.code === 'payment_refused') || (await this.gateway.retrieve(authorization.paymentIntentId!)).status !== 'canceled')
        throw err;
      Object.assign(authorization, { state: 'lapsed', settledAt: new Date() });
      await tx.save(DepositAuthorization, authorization);
      return 0;
    }
  }

  private async assertSettleable(tx: Scoped, rental: RentalRecord) {
    const booking = await loadBooking(tx, rental.bookingId);
    if (booking.state !== 'returned') throw ruleBroken('booking_state', `Charges are taken at return; this rental is ${booking.state}.`);
    if (await tx.count(Invoice, { rentalId: rental.id, kind: 'invoice' }))
      throw ruleBroken('already_invoiced', `Rental ${rental.number} is invoiced; correct it with a credit note.`);
  }

  /** Charges the saved card at once (merchant-initiated); a decline is recorded and reported. */
  private async chargeCard(tx: Scoped, rental: RentalRecord, amountMinor: number, reason: string, authorization: DepositAuthorization | null) {
    if (!rental.paymentMethodId)
      throw ruleBroken('no_card', `No card is saved for rental ${rental.number}: put ${(await moneyOf(tx, rental))(amountMinor)} on the invoice instead.`);
    const charges = await tx.count(DepositAuthorization, { rentalId: rental.id, kind: 'charge' });
    const key = `rental:${rental.id}:charge:${authorization?.id ?? 'card'}:${charges + 1}`;
    const outcome = await this.gateway.confirmIntent({
      amountMinor,
      currency: rental.currency,
      customer: await providerCustomer(tx, this.gateway, rental.customerId),
      paymentMethod: rental.paymentMethodId,
      capture: 'automatic',
      offSession: true,
      description: `Rental ${rental.number}: ${reason}`,
      metadata: { rentalId: rental.id, organizationId: tx.organizationId, purpose: 'charge' },
      key,
    });
    return this.record(tx, rental, { kind: 'charge', key, amountMinor, initiatedBy: 'merchant', outcome, reason });
  }

  private async record(
    tx: Scoped,
    rental: RentalRecord,
    r: {
      kind: DepositAuthorization['kind'];
      key: string;
      amountMinor: number;
      initiatedBy: DepositAuthorization['initiatedBy'];
      outcome: IntentOutcome;
      reason?: string;
    },
  ) {
    const o = r.outcome;
    const existing = await tx.findOne(DepositAuthorization, { idempotencyKey: r.key });
    if (existing) return existing; // a replayed request: already on record
    return tx.insert(DepositAuthorization, {
      rentalId: rental.id,
      kind: r.kind,
      paymentIntentId: o.id,
      idempotencyKey: r.key,
      state: !o.ok ? 'declined' : r.kind === 'charge' ? 'captured' : 'authorized',
      amountMinor: r.amountMinor,
      capturedMinor: o.ok && r.kind === 'charge' ? o.capturedMinor : 0,
      cardBrand: o.ok ? o.cardBrand : null,
      cardLast4: o.ok ? o.cardLast4 : null,
      captureBefore: o.ok && r.kind === 'authorization' ? o.captureBefore : null,
      initiatedBy: r.initiatedBy,
      failureMessage: o.ok ? null : o.message,
      captureReason: r.reason ?? null,
      settledAt: r.kind === 'charge' || !o.ok ? new Date() : null,
    });
  }
}
