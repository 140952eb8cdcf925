import type { DataSource } from 'typeorm';
import { formatMoney } from '../../shared/billing/money';
import type { DepositRequestReply } from '../../shared/billing/views';
import { recordAudit } from '../audit/audit.service';
import { loadBooking } from '../bookings';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { AppError, conflict, ruleBroken } from '../http/errors';
import { enqueueMail } from '../notifications';
import { depositRequestMail } from './billing-mail';
import { getCustomer, issueRenterLink, loadRentalView, lockRental, RENTER_LINK_DAYS, type RentalRecord } from '../rentals';
import { DepositAuthorization } from './deposit-authorization.entity';
import { DepositRequest } from './deposit-request.entity';
import { depositState } from './deposit-state';
import type { PaymentGateway } from './payment-gateway';
import { providerCustomer } from './provider-customer';
import { rentalMoney } from './rental-money';

/** Where the provider sends the renter back; the renter's page picks up from there (the hosted page never learns the renter's link). */
const returnUrl = (publicUrl: string, left: boolean) => `${publicUrl}/renter/returned?session={CHECKOUT_SESSION_ID}${left ? '&left=1' : ''}`;

/**
 * The renter places the deposit's card authorization themselves, on the
 * provider's hosted page: the clerk asks for it here, the renter gets a link
 * to their own page by e-mail, and the authorization is recorded from the
 * provider's signed event (deposit-request-events.ts), never from the return.
 */
export class DepositRequestsService {
  constructor(
    private readonly db: DataSource,
    private readonly gateway: PaymentGateway,
    private readonly publicUrl: string,
  ) {}

  /**
   * One transaction around the provider call, holding the rental's lock: when
   * the provider is down nothing is written (no link, no mail) and the clerk
   * gets a 502; the retry sends the same key, so a session the provider made
   * before its answer was lost is replayed, not made twice.
   */
  async request(actor: Actor, rentalId: string): Promise<DepositRequestReply> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await lockRental(tx, rentalId);
      const booking = await loadBooking(tx, rental.bookingId);
      if (booking.state !== 'reserved' && booking.state !== 'out')
        throw ruleBroken('booking_state', `The deposit is taken before handing over; this rental is ${booking.state}.`);
      if (rental.depositMinor <= 0) throw ruleBroken('no_deposit', 'This rental has no deposit to authorize (the firm’s deposit policy gave nothing).');
      if (depositState(await tx.find(DepositAuthorization, { where: { rentalId } })).state === 'authorized')
        throw conflict(`The card is already authorized for ${money(rental, rental.depositMinor)}.`);
      const earlier = await tx.find(DepositRequest, { where: { rentalId }, order: { createdAt: 'ASC' } });
      await this.closeEarlier(tx, earlier);
      const customer = await getCustomer(tx, rental.customerId);
      const key = `rental:${rental.id}:checkout:${earlier.length + 1}`;
      const session = await this.gateway.openCheckout({
        amountMinor: rental.depositMinor,
        currency: rental.currency,
        customer: await providerCustomer(tx, this.gateway, customer.id),
        name: `Deposit for rental ${rental.number} (card authorization, not a charge)`,
        metadata: { rentalId: rental.id, organizationId: actor.organizationId, purpose: 'deposit', depositRequest: key },
        successUrl: returnUrl(this.publicUrl, false),
        cancelUrl: returnUrl(this.publicUrl, true),
        key,
      });
      const link = await issueRenterLink(tx, rental.id);
      const renterUrl = `${this.publicUrl}/renter/${link.token}`;
      await tx.insert(DepositRequest, {
        rentalId,
        checkoutSessionId: session.id,
        url: session.url,
        expiresAt: session.expiresAt,
        state: 'open',
        idempotencyKey: key,
        sentTo: customer.billingEmail,
        declineMessage: null,
        requestedBy: actor.userId,
      });
      const view = await loadRentalView(tx, rental, rentalMoney);
      await enqueueMail(tx, [customer.billingEmail], depositRequestMail, {
        rental: { number: rental.number, currency: rental.currency, startsOn: view.startsOn, endsOn: view.endsOn, depositMinor: rental.depositMinor },
        customer,
        renterUrl,
        linkDays: RENTER_LINK_DAYS,
      });
      await recordAudit(
        tx,
        actor,
        'deposit.requested',
        { type: 'rental', id: rental.id },
        { checkoutSessionId: session.id, sentTo: customer.billingEmail, amountMinor: rental.depositMinor, replaced: earlier.filter(isOpen).length },
      );
      return { url: session.url, expiresAt: session.expiresAt.toISOString(), renterUrl, renterLinkExpiresAt: link.expiresAt.toISOString(), rental: view };
    });
  }

  /** A new link replaces the pages sent before: each still open is expired at the provider first, so only one can authorize the card. */
  private async closeEarlier(tx: Scoped, earlier: DepositRequest[]) {
    for (const request of earlier.filter(isOpen)) {
      if (request.expiresAt > new Date()) {
        const session = await this.gateway.expireCheckout(request.checkoutSessionId, `${request.idempotencyKey}:expire`).catch(async (err: unknown) => {
          // Already closed at the provider (paid or expired a moment ago): its event tells the rest.
          if (err instanceof AppError && err.code === 'payment_refused') return this.gateway.retrieveCheckout(request.checkoutSessionId);
          throw err;
        });
        if (session.status === 'complete')
          throw conflict('The renter has just authorized the card on the page sent before; reload the rental to see the authorization.');
      }
      await tx.updateWhere(DepositRequest, { id: request.id }, { state: 'replaced' });
    }
  }
}

const isOpen = (r: DepositRequest) => r.state === 'open';
const money = (rental: RentalRecord, minor: number) => formatMoney(minor, rental.currency, 'en-GB');
