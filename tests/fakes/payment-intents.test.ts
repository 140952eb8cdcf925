import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createPaymentClient } from '../../server/billing/payment-client';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payment-fake';

const SECRET_KEY = 'sk_test_nestkeeper';
const DAY = 24 * 60 * 60;

/** Deposit holds against the payment-provider fake, driven by the official SDK.
 * Each test names the provider's reference page it checks. */
describe('payment-provider fake: payment methods, manual-capture intents, refunds', () => {
  let fake: PaymentFake;
  let stripe: Stripe;

  const control = async (path: string, body: unknown) => {
    const res = await fetch(`http://127.0.0.1:${fake.port}/__fake${path}`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify(body),
    });
    expect(res.status).toBe(200);
    return res.json() as Promise<Record<string, unknown>>;
  };
  const advance = (seconds: number) => control('/clock', { advanceSeconds: seconds });

  const card = (token: string) => stripe.paymentMethods.create({ type: 'card', card: { token } });
  /** A manual-capture deposit hold, confirmed at once. */
  const hold = async (token: string, amount: number, extra: Partial<Stripe.PaymentIntentCreateParams> = {}) => {
    const pm = await card(token);
    return stripe.paymentIntents.create({
      amount,
      currency: 'gbp',
      payment_method: pm.id,
      capture_method: 'manual',
      confirm: true,
      ...extra,
    });
  };
  const chargeOf = async (pi: Stripe.PaymentIntent) => stripe.charges.retrieve(pi.latest_charge as string);

  beforeAll(async () => {
    fake = await startPaymentFake({ port: 0 });
    stripe = createPaymentClient({
      PAYMENT_API_KEY: SECRET_KEY,
      PAYMENT_API_HOST: '127.0.0.1',
      PAYMENT_API_PORT: fake.port,
      PAYMENT_API_PROTOCOL: 'http',
      PAYMENT_TIMEOUT_MS: 15_000,
    });
  });
  afterAll(async () => {
    await fake.close();
  });

  // https://docs.stripe.com/api/payment_methods/create, /attach, /retrieve; test tokens from https://docs.stripe.com/testing#cards
  it('creates card payment methods from the published test tokens, attaches and retrieves them', async () => {
    const visa = await card('tok_visa');
    expect(visa.id).toMatch(/^pm_[A-Za-z0-9]{24}$/);
    expect(visa).toMatchObject({ object: 'payment_method', type: 'card', customer: null });
    expect(visa.card).toMatchObject({ brand: 'visa', last4: '4242' });
    expect(visa.card!.exp_month).toBeGreaterThanOrEqual(1);
    expect(visa.card!.exp_year).toBeGreaterThan(new Date().getUTCFullYear());
    expect((await card('tok_mastercard')).card).toMatchObject({ brand: 'mastercard', last4: '4444' });
    expect((await card('tok_chargeDeclined')).card!.last4).toBe('0002');
    expect((await card('tok_chargeDeclinedInsufficientFunds')).card!.last4).toBe('9995');

    const customer = await stripe.customers.create({ name: 'Kestrel Survey Works' });
    const attached = await stripe.paymentMethods.attach(visa.id, { customer: customer.id });
    expect(attached.customer).toBe(customer.id);
    expect((await stripe.paymentMethods.retrieve(visa.id)).customer).toBe(customer.id);
    const listed = await stripe.paymentMethods.list({ customer: customer.id, type: 'card' });
    expect(listed.data.map((p) => p.id)).toEqual([visa.id]);

    const unknownToken = await card('tok_unheard_of').catch((e: unknown) => e);
    expect(unknownToken).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    const missing = (await stripe.paymentMethods.retrieve('pm_nope').catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(missing.code).toBe('resource_missing');
  });

  // https://docs.stripe.com/payments/paymentintents/lifecycle and https://docs.stripe.com/api/payment_intents/confirm
  it('walks requires_payment_method → requires_confirmation → requires_capture', async () => {
    const customer = await stripe.customers.create({ name: 'Harrow Lane Fabrication' });
    const created = await stripe.paymentIntents.create({
      amount: 25_000,
      currency: 'GBP',
      customer: customer.id,
      capture_method: 'manual',
      metadata: { bookingId: 'BK-1001' },
    });
    expect(created).toMatchObject({
      object: 'payment_intent',
      status: 'requires_payment_method',
      amount: 25_000,
      currency: 'gbp',
      capture_method: 'manual',
      amount_capturable: 0,
      amount_received: 0,
      latest_charge: null,
      metadata: { bookingId: 'BK-1001' },
    });
    expect(created.id).toMatch(/^pi_/);

    const pm = await card('tok_visa');
    const withMethod = await stripe.paymentIntents.update(created.id, { payment_method: pm.id });
    expect(withMethod.status).toBe('requires_confirmation');

    const confirmed = await stripe.paymentIntents.confirm(created.id);
    expect(confirmed).toMatchObject({ status: 'requires_capture', amount_capturable: 25_000, amount_received: 0, payment_method: pm.id });
    expect(confirmed.latest_charge).toMatch(/^ch_/);

    // latest_charge is expandable and retrievable: an uncaptured authorization.
    const expanded = await stripe.paymentIntents.retrieve(created.id, { expand: ['latest_charge'] });
    const charge = expanded.latest_charge as Stripe.Charge;
    expect(charge).toMatchObject({
      object: 'charge',
      id: confirmed.latest_charge,
      captured: false,
      amount: 25_000,
      amount_captured: 0,
      status: 'succeeded',
      paid: true,
    });
    expect(charge.payment_method_details!.card).toMatchObject({ brand: 'visa', last4: '4242' });
    expect(await stripe.charges.retrieve(charge.id)).toMatchObject({ id: charge.id, payment_intent: created.id });

    // Capturing twice is refused.
    await stripe.paymentIntents.capture(created.id);
    const again = (await stripe.paymentIntents.capture(created.id).catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(again).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(again.code).toBe('payment_intent_unexpected_state');
  });

  // https://docs.stripe.com/api/payment_intents/capture (amount_to_capture) and
  // https://docs.stripe.com/payments/place-a-hold-on-a-payment-method#capture-funds
  it('captures part of a hold, releasing the rest', async () => {
    const pi = await hold('tok_visa', 30_000);
    const tooMuch = (await stripe.paymentIntents.capture(pi.id, { amount_to_capture: 30_001 }).catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(tooMuch).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(tooMuch.param).toBe('amount_to_capture');

    const captured = await stripe.paymentIntents.capture(pi.id, { amount_to_capture: 4_500 });
    expect(captured).toMatchObject({ status: 'succeeded', amount: 30_000, amount_received: 4_500, amount_capturable: 0 });
    const charge = await chargeOf(captured);
    expect(charge).toMatchObject({ captured: true, amount: 30_000, amount_captured: 4_500, amount_refunded: 0 });
  });

  // https://docs.stripe.com/api/payment_intents/cancel
  it('cancels a hold from requires_capture and refuses to cancel a captured one', async () => {
    const pi = await hold('tok_mastercard', 15_000);
    const canceled = await stripe.paymentIntents.cancel(pi.id, { cancellation_reason: 'abandoned' });
    expect(canceled).toMatchObject({ status: 'canceled', cancellation_reason: 'abandoned', amount_capturable: 0, amount_received: 0 });
    expect(canceled.canceled_at).toEqual(expect.any(Number));
    const capture = (await stripe.paymentIntents.capture(pi.id).catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(capture.code).toBe('payment_intent_unexpected_state');

    const early = await stripe.paymentIntents.create({ amount: 1_000, currency: 'gbp', capture_method: 'manual' });
    expect((await stripe.paymentIntents.cancel(early.id)).status).toBe('canceled');

    const done = await hold('tok_visa', 2_000);
    await stripe.paymentIntents.capture(done.id);
    const late = (await stripe.paymentIntents.cancel(done.id).catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(late).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(late.code).toBe('payment_intent_unexpected_state');
  });

  // https://docs.stripe.com/testing#declined-payments and https://docs.stripe.com/api/errors (card_error, HTTP 402)
  it.each([
    ['tok_chargeDeclined', 'generic_decline', 'Your card was declined.'],
    ['tok_chargeDeclinedInsufficientFunds', 'insufficient_funds', 'Your card has insufficient funds.'],
  ])('declines %s at confirmation with decline_code %s', async (token, declineCode, message) => {
    const pm = await card(token); // creating the payment method itself succeeds
    const pi = await stripe.paymentIntents.create({ amount: 9_000, currency: 'gbp', payment_method: pm.id, capture_method: 'manual' });
    const error = (await stripe.paymentIntents.confirm(pi.id).catch((e: unknown) => e)) as Stripe.errors.StripeCardError;
    expect(error).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(error.statusCode).toBe(402);
    expect(error.type).toBe('StripeCardError');
    expect(error.raw).toMatchObject({ type: 'card_error', code: 'card_declined', decline_code: declineCode, message });
    expect(error.code).toBe('card_declined');
    expect(error.decline_code).toBe(declineCode);
    expect(error.payment_intent).toMatchObject({ id: pi.id, status: 'requires_payment_method' });

    const after = await stripe.paymentIntents.retrieve(pi.id);
    expect(after).toMatchObject({ status: 'requires_payment_method', payment_method: null, amount_capturable: 0 });
    expect(after.last_payment_error).toMatchObject({ type: 'card_error', code: 'card_declined', decline_code: declineCode });
    expect(await chargeOf(after)).toMatchObject({ status: 'failed', paid: false, failure_code: 'card_declined' });

    // A new card on the same intent can then succeed.
    const good = await card('tok_visa');
    expect((await stripe.paymentIntents.confirm(pi.id, { payment_method: good.id })).status).toBe('requires_capture');
  });

  // https://docs.stripe.com/payments/place-a-hold-on-a-payment-method ("Authorization validity windows", card-not-present)
  it('sets capture_before: 7 days customer-initiated; off-session Visa 4 d 18 h; off-session Mastercard 7 d', async () => {
    const customer = await stripe.customers.create({ name: 'Moorgate Optics' });
    const cases: Array<[string, boolean, number]> = [
      ['tok_visa', false, 7 * DAY],
      ['tok_mastercard', false, 7 * DAY],
      ['tok_visa', true, 4 * DAY + 18 * 3600],
      ['tok_mastercard', true, 7 * DAY],
    ];
    for (const [token, offSession, window] of cases) {
      const pm = await card(token);
      await stripe.paymentMethods.attach(pm.id, { customer: customer.id });
      const pi = await stripe.paymentIntents.create({
        amount: 40_000,
        currency: 'gbp',
        customer: customer.id,
        payment_method: pm.id,
        capture_method: 'manual',
        confirm: true,
        ...(offSession ? { off_session: true } : {}),
      });
      const charge = await chargeOf(pi);
      expect(charge.payment_method_details!.card!.capture_before! - charge.created, `${token} off_session=${offSession}`).toBe(window);
    }
  });

  // https://docs.stripe.com/payments/place-a-hold-on-a-payment-method (expiry → canceled);
  // https://docs.stripe.com/error-codes (charge_expired_for_capture)
  it('captures just before capture_before, and after it fails with charge_expired_for_capture, leaving the intent canceled', async () => {
    const customer = await stripe.customers.create({ name: 'Tarn Metrology' });
    const pm = await card('tok_visa');
    await stripe.paymentMethods.attach(pm.id, { customer: customer.id });
    const offSession = {
      amount: 50_000,
      currency: 'gbp',
      customer: customer.id,
      payment_method: pm.id,
      capture_method: 'manual' as const,
      confirm: true,
      off_session: true,
    };

    const inTime = await stripe.paymentIntents.create(offSession);
    const late = await stripe.paymentIntents.create(offSession);
    const captureBefore = (await chargeOf(late)).payment_method_details!.card!.capture_before!;
    const { now } = (await control('/clock', { advanceSeconds: 0 })) as { now: number };

    await advance(captureBefore - now - 60); // one minute left
    expect((await stripe.paymentIntents.capture(inTime.id, { amount_to_capture: 1_200 })).status).toBe('succeeded');

    await advance(120); // one minute past
    const error = (await stripe.paymentIntents.capture(late.id).catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error.code).toBe('charge_expired_for_capture');
    const after = await stripe.paymentIntents.retrieve(late.id);
    expect(after).toMatchObject({ status: 'canceled', cancellation_reason: 'automatic', amount_capturable: 0, amount_received: 0 });
    expect(after.canceled_at).toBe(captureBefore);
    // The captured one is unaffected by time passing.
    expect((await stripe.paymentIntents.retrieve(inTime.id)).status).toBe('succeeded');
  });

  // https://docs.stripe.com/api/refunds/create
  it('refunds up to the captured amount minus earlier refunds', async () => {
    const pi = await stripe.paymentIntents.capture((await hold('tok_visa', 20_000)).id, { amount_to_capture: 8_000 });
    const first = await stripe.refunds.create({ payment_intent: pi.id, amount: 3_000, reason: 'requested_by_customer' });
    expect(first).toMatchObject({ object: 'refund', amount: 3_000, payment_intent: pi.id, charge: pi.latest_charge, status: 'succeeded', currency: 'gbp' });
    expect(first.id).toMatch(/^re_/);

    const tooMuch = (await stripe.refunds.create({ payment_intent: pi.id, amount: 5_001 }).catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(tooMuch).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(tooMuch.param).toBe('amount');

    const rest = await stripe.refunds.create({ payment_intent: pi.id }); // defaults to what is left
    expect(rest.amount).toBe(5_000);
    expect(await chargeOf(pi)).toMatchObject({ amount_captured: 8_000, amount_refunded: 8_000, refunded: true });
    const none = (await stripe.refunds.create({ payment_intent: pi.id, amount: 1 }).catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(none.code).toBe('charge_already_refunded');
    expect((await stripe.refunds.retrieve(first.id)).amount).toBe(3_000);
    expect((await stripe.refunds.list({ payment_intent: pi.id })).data.map((r) => r.id)).toEqual([rest.id, first.id]);

    const uncaptured = await hold('tok_visa', 1_000);
    const refused = (await stripe.refunds.create({ payment_intent: uncaptured.id }).catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(refused.code).toBe('charge_not_refundable');
  });

  // https://docs.stripe.com/api/idempotent_requests
  it('replays the first response for every POST above under a repeated Idempotency-Key', async () => {
    const key = (n: string) => ({ idempotencyKey: `nk-intents-${n}` });
    const pmParams = { type: 'card' as const, card: { token: 'tok_visa' } };
    const pm = await stripe.paymentMethods.create(pmParams, key('pm'));
    expect((await stripe.paymentMethods.create(pmParams, key('pm'))).id).toBe(pm.id);

    const customer = await stripe.customers.create({ name: 'Alder Row' });
    const attach = await stripe.paymentMethods.attach(pm.id, { customer: customer.id }, key('attach'));
    const attachAgain = await stripe.paymentMethods.attach(pm.id, { customer: customer.id }, key('attach'));
    expect(attachAgain.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(attachAgain.customer).toBe(attach.customer);

    const piParams = { amount: 12_000, currency: 'gbp', customer: customer.id, payment_method: pm.id, capture_method: 'manual' as const };
    const pi = await stripe.paymentIntents.create(piParams, key('pi'));
    const piAgain = await stripe.paymentIntents.create(piParams, key('pi'));
    expect(piAgain.id).toBe(pi.id);
    expect(piAgain.lastResponse.headers['idempotent-replayed']).toBe('true');

    const confirmed = await stripe.paymentIntents.confirm(pi.id, {}, key('confirm'));
    expect((await stripe.paymentIntents.confirm(pi.id, {}, key('confirm'))).latest_charge).toBe(confirmed.latest_charge);

    await stripe.paymentIntents.capture(pi.id, { amount_to_capture: 7_000 }, key('capture'));
    const captureAgain = await stripe.paymentIntents.capture(pi.id, { amount_to_capture: 7_000 }, key('capture'));
    expect(captureAgain).toMatchObject({ status: 'succeeded', amount_received: 7_000 });
    expect(captureAgain.lastResponse.headers['idempotent-replayed']).toBe('true');

    const refund = await stripe.refunds.create({ payment_intent: pi.id, amount: 1_000 }, key('refund'));
    expect((await stripe.refunds.create({ payment_intent: pi.id, amount: 1_000 }, key('refund'))).id).toBe(refund.id);
    expect((await chargeOf(captureAgain)).amount_refunded).toBe(1_000);

    const other = await hold('tok_visa', 500);
    const cancel = await stripe.paymentIntents.cancel(other.id, {}, key('cancel'));
    expect((await stripe.paymentIntents.cancel(other.id, {}, key('cancel'))).canceled_at).toBe(cancel.canceled_at);

    // A decline is kept too: the replay is the same 402.
    const bad = await card('tok_chargeDeclined');
    const declineParams = { amount: 700, currency: 'gbp', payment_method: bad.id, capture_method: 'manual' as const, confirm: true };
    const d1 = (await stripe.paymentIntents.create(declineParams, key('decline')).catch((e: unknown) => e)) as Stripe.errors.StripeCardError;
    const d2 = (await stripe.paymentIntents.create(declineParams, key('decline')).catch((e: unknown) => e)) as Stripe.errors.StripeCardError;
    expect(d2).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(d2.payment_intent!.id).toBe(d1.payment_intent!.id);
    expect(d2.headers?.['idempotent-replayed']).toBe('true');
  });
});

describe('payment-provider fake: authorizations lapse on their own as the clock moves', () => {
  // https://docs.stripe.com/payments/place-a-hold-on-a-payment-method ("the funds are released and the payment status changes to canceled")
  it('cancels an uncaptured hold when POST /__fake/clock moves past capture_before, with a payment_intent.canceled event', async () => {
    const fake = await startPaymentFake({ port: 0 });
    try {
      const stripe = createPaymentClient({
        PAYMENT_API_KEY: SECRET_KEY,
        PAYMENT_API_HOST: '127.0.0.1',
        PAYMENT_API_PORT: fake.port,
        PAYMENT_API_PROTOCOL: 'http',
        PAYMENT_TIMEOUT_MS: 15_000,
      });
      const pi = await stripe.paymentIntents.create({
        amount: 6_000,
        currency: 'gbp',
        payment_method: 'pm_card_visa',
        capture_method: 'manual',
        confirm: true,
      });
      const before = await fetch(`http://127.0.0.1:${fake.port}/__fake/clock`).then((r) => r.json() as Promise<{ now: number }>);
      const moved = await fetch(`http://127.0.0.1:${fake.port}/__fake/clock`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
        body: `advanceSeconds=${7 * DAY}`,
      }).then((r) => r.json() as Promise<{ now: number }>);
      expect(moved.now - before.now).toBe(7 * DAY);

      // No request touched the intent; the sweep after the clock move lapsed it.
      const events = await stripe.events.list({ type: 'payment_intent.canceled' });
      expect(events.data.map((e) => (e.data.object as Stripe.PaymentIntent).id)).toEqual([pi.id]);
      expect(events.data[0]!.data.object).toMatchObject({ status: 'canceled', cancellation_reason: 'automatic' });
      const charge = await stripe.charges.retrieve(pi.latest_charge as string);
      expect(charge).toMatchObject({ captured: false, refunded: true });

      const backwards = await fetch(`http://127.0.0.1:${fake.port}/__fake/clock`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ advanceSeconds: -1 }),
      });
      expect(backwards.status).toBe(400);
    } finally {
      await fake.close();
    }
  });
});
