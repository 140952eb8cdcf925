import Stripe from 'stripe';
import { formatMoney } from '../../shared/billing/money';
import { fromProviderAmount, providerStepMinor, toProviderAmount } from '../../shared/billing/provider-amounts';
import { AppError } from '../http/errors';

/** What Nestkeeper needs from a PaymentIntent. */
export type IntentOutcome =
  | {
      ok: true;
      id: string;
      status: string;
      amountMinor: number;
      capturedMinor: number;
      captureBefore: Date | null;
      cardBrand: string | null;
      cardLast4: string | null;
    }
  | { ok: false; id: string | null; message: string; declineCode: string | null };

const cardOf = (charge: Stripe.Charge | string | null) => (charge && typeof charge === 'object' ? charge.payment_method_details?.card : undefined);

function outcome(pi: Stripe.PaymentIntent): IntentOutcome {
  const card = cardOf(pi.latest_charge as Stripe.Charge | string | null);
  const captureBefore = (card as { capture_before?: number } | undefined)?.capture_before;
  return {
    ok: true,
    id: pi.id,
    status: pi.status,
    amountMinor: fromProviderAmount(pi.amount, pi.currency),
    capturedMinor: fromProviderAmount(pi.amount_received, pi.currency),
    captureBefore: captureBefore ? new Date(captureBefore * 1000) : null,
    cardBrand: card?.brand ?? null,
    cardLast4: card?.last4 ?? null,
  };
}

/**
 * Our ISO 4217 minor units as the provider's `amount` (its zero-decimal,
 * three-decimal and special-case rules: shared/billing/provider-amounts.ts).
 * An amount it cannot take is refused here with the step it can take, before any call.
 */
function providerAmount(minor: number, currency: string): number {
  const step = providerStepMinor(currency);
  if (minor % step !== 0) {
    throw new AppError(
      422,
      'amount_not_accepted',
      `The payment provider takes ${currency} in steps of ${formatMoney(step, currency, 'en-GB')}; ${formatMoney(minor, currency, 'en-GB')} is not one. Round it to a step.`,
      { stepMinor: step },
    );
  }
  return toProviderAmount(minor, currency);
}

/** The provider could not be reached or failed on its side: nothing to show the customer, try again (same key, no double charge). */
const unavailable = (err: Error) =>
  new AppError(
    502,
    'payment_unavailable',
    `The payment provider did not answer (${err.message}). Try again: a repeated request is recognised, so nothing is charged twice.`,
  );

/** The SDK's errors as the API's: outages as 502, a clashing replay as 409, the rest as 422 naming the provider's words. */
function providerError(err: unknown): unknown {
  if (
    err instanceof Stripe.errors.StripeConnectionError ||
    err instanceof Stripe.errors.StripeAPIError ||
    (err instanceof Stripe.errors.StripeError && (err.statusCode ?? 0) >= 500)
  )
    return unavailable(err);
  if (err instanceof Stripe.errors.StripeIdempotencyError)
    return new AppError(409, 'conflict', 'A different request with the same purpose is already under way at the payment provider; reload and try again.');
  if (err instanceof Stripe.errors.StripeError)
    return new AppError(422, 'payment_refused', `The payment provider refused: ${err.message}`, { providerCode: err.code ?? null });
  return err;
}

const call = <T>(work: () => Promise<T>): Promise<T> =>
  work().catch((err: unknown) => {
    throw providerError(err);
  });

/**
 * The provider operations behind deposits, each with the idempotency key the
 * caller derives from the operation (a retry after a timeout replays the
 * first answer instead of charging again).
 */
export class PaymentGateway {
  constructor(readonly client: Stripe) {}

  /** The provider's customer record for one of our customers. */
  async ensureCustomer(customer: { id: string; company: string; billingEmail: string }): Promise<string> {
    const created = await call(() =>
      this.client.customers.create(
        { name: customer.company, email: customer.billingEmail, metadata: { nestkeeperCustomerId: customer.id } },
        { idempotencyKey: `customer:${customer.id}` },
      ),
    );
    return created.id;
  }

  /** Saves the card the customer presented (a payment method made by the provider's card form) to their record. */
  async saveCard(paymentMethod: string, providerCustomer: string, key: string): Promise<string> {
    const pm = await call(() => this.client.paymentMethods.attach(paymentMethod, { customer: providerCustomer }, { idempotencyKey: key }));
    return pm.id;
  }

  /** Authorizes the card (manual capture) or, with `capture: 'automatic'`, charges at once. Declines come back as `ok: false`. */
  async confirmIntent(p: {
    amountMinor: number;
    currency: string;
    customer: string;
    paymentMethod: string;
    capture: 'manual' | 'automatic';
    offSession: boolean;
    description: string;
    metadata: Record<string, string>;
    key: string;
  }): Promise<IntentOutcome> {
    const create = () =>
      this.client.paymentIntents.create(
        {
          amount: providerAmount(p.amountMinor, p.currency),
          currency: p.currency.toLowerCase(),
          customer: p.customer,
          payment_method: p.paymentMethod,
          capture_method: p.capture,
          confirm: true,
          ...(p.offSession ? { off_session: true } : {}),
          description: p.description,
          metadata: p.metadata,
          expand: ['latest_charge'],
        },
        { idempotencyKey: p.key },
      );
    try {
      return outcome(await create());
    } catch (err) {
      // A declined card is an answer, not a failure: it is recorded and shown.
      if (err instanceof Stripe.errors.StripeCardError)
        return { ok: false, id: err.payment_intent?.id ?? null, message: err.message, declineCode: err.decline_code ?? null };
      throw providerError(err);
    }
  }

  async capture(intentId: string, amountMinor: number, currency: string, key: string): Promise<IntentOutcome> {
    const amount = providerAmount(amountMinor, currency);
    return outcome(
      await call(() => this.client.paymentIntents.capture(intentId, { amount_to_capture: amount, expand: ['latest_charge'] }, { idempotencyKey: key })),
    );
  }

  async cancel(intentId: string, key: string): Promise<IntentOutcome> {
    return outcome(
      await call(() =>
        this.client.paymentIntents.cancel(intentId, { cancellation_reason: 'requested_by_customer', expand: ['latest_charge'] }, { idempotencyKey: key }),
      ),
    );
  }

  /**
   * A hosted payment page for the renter (a Checkout Session): the card is
   * authorized for `amountMinor` with manual capture and saved to the
   * customer for later off-session use (renewals, charges above the
   * authorization). It lives the provider's default 24 hours: a retry under
   * the same key must send the same parameters, so no clock reading goes in.
   */
  async openCheckout(p: {
    amountMinor: number;
    currency: string;
    customer: string;
    name: string;
    metadata: Record<string, string>;
    successUrl: string;
    cancelUrl: string;
    key: string;
  }): Promise<{ id: string; url: string; expiresAt: Date }> {
    const session = await call(() =>
      this.client.checkout.sessions.create(
        {
          mode: 'payment',
          customer: p.customer,
          line_items: [
            {
              quantity: 1,
              price_data: { currency: p.currency.toLowerCase(), unit_amount: providerAmount(p.amountMinor, p.currency), product_data: { name: p.name } },
            },
          ],
          payment_intent_data: { capture_method: 'manual', setup_future_usage: 'off_session', description: p.name, metadata: p.metadata },
          metadata: p.metadata,
          success_url: p.successUrl,
          cancel_url: p.cancelUrl,
        },
        { idempotencyKey: p.key },
      ),
    );
    if (!session.url) throw unavailable(new Error('the provider made a payment page without an address'));
    return { id: session.id, url: session.url, expiresAt: new Date(session.expires_at * 1000) };
  }

  /** The session as the provider holds it now, with its PaymentIntent and that intent's charge. */
  async retrieveCheckout(sessionId: string): Promise<Stripe.Checkout.Session> {
    return call(() => this.client.checkout.sessions.retrieve(sessionId, { expand: ['payment_intent', 'payment_intent.latest_charge'] }));
  }

  /** Closes a hosted page that a newer request replaces, so the renter cannot authorize the deposit twice. */
  async expireCheckout(sessionId: string, key: string): Promise<Stripe.Checkout.Session> {
    return call(() => this.client.checkout.sessions.expire(sessionId, {}, { idempotencyKey: key }));
  }

  /** What Nestkeeper keeps of an intent authorized on the hosted page. */
  describeIntent(pi: Stripe.PaymentIntent): IntentOutcome {
    return outcome(pi);
  }

  async retrieve(intentId: string): Promise<Stripe.PaymentIntent> {
    return call(() => this.client.paymentIntents.retrieve(intentId, { expand: ['latest_charge'] }));
  }

  /** Checks the provider's signature on a webhook delivery (the SDK's own check, tolerance 5 minutes). */
  verifyEvent(rawBody: Buffer, signature: string, secret: string): Stripe.Event {
    return this.client.webhooks.constructEvent(rawBody, signature, secret);
  }
}
