import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payment-fake';

const SECRET_KEY = 'sk_test_nestkeeper';
// A client that gives up on a withheld reply, yet not on an ordinary one from a busy machine;
// the fake withholds its reply well past that (it stops waiting when the client hangs up).
const CLIENT_TIMEOUT_MS = 2_000;
const HANG_MS = 5 * CLIENT_TIMEOUT_MS;

/** Fault injection (POST /__fake/faults) against the payment-provider fake. */
describe('payment-provider fake: faults, timeouts and retried captures', () => {
  let fake: PaymentFake;

  const sdk = (opts: Partial<Stripe.StripeConfig> = {}) => new Stripe(SECRET_KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http', ...opts });
  const fault = async (body: Record<string, unknown>) => {
    const res = await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify(body),
    });
    expect(res.status).toBe(200);
  };
  const pendingFaults = async () => ((await (await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`)).json()) as { data: unknown[] }).data;
  const hold = (stripe: Stripe, amount: number) =>
    stripe.paymentIntents.create({ amount, currency: 'gbp', payment_method: 'pm_card_visa', capture_method: 'manual', confirm: true });
  const eventsFor = async (stripe: Stripe, type: string, objectId: string) =>
    (await stripe.events.list({ type, limit: 100 })).data.filter((e) => (e.data.object as { id: string }).id === objectId);

  beforeAll(async () => {
    fake = await startPaymentFake({ port: 0 });
  });
  afterAll(async () => {
    await fake.close();
  });

  // https://docs.stripe.com/api/idempotent_requests ("safely retrying requests
  // without accidentally performing the same operation twice") with the SDK's
  // automatic retries (maxNetworkRetries reuses one Idempotency-Key per call).
  it('captures exactly once when the first capture times out and the SDK retries', async () => {
    const stripe = sdk({ maxNetworkRetries: 2, timeout: CLIENT_TIMEOUT_MS });
    const pi = await hold(stripe, 30_000);
    await fault({ path: '/v1/payment_intents/:id/capture', mode: 'timeout', times: 1, hangMs: HANG_MS });

    const captured = await stripe.paymentIntents.capture(pi.id, { amount_to_capture: 4_200 });
    expect(await pendingFaults()).toEqual([]); // the first attempt met the withheld reply
    expect(captured).toMatchObject({ status: 'succeeded', amount_received: 4_200, amount_capturable: 0 });
    expect(captured.lastResponse.headers['idempotent-replayed']).toBe('true'); // the retry got the first result

    const charge = await stripe.charges.retrieve(captured.latest_charge as string);
    expect(charge).toMatchObject({ captured: true, amount_captured: 4_200 });
    expect(await eventsFor(stripe, 'payment_intent.succeeded', pi.id)).toHaveLength(1);
    expect(await eventsFor(stripe, 'charge.captured', charge.id)).toHaveLength(1);
  });

  it('lets a caller retry a timed-out capture by hand under its own Idempotency-Key, once', async () => {
    const noRetries = sdk({ maxNetworkRetries: 0, timeout: CLIENT_TIMEOUT_MS });
    const pi = await hold(noRetries, 10_000);
    await fault({ path: '/v1/payment_intents/:id/capture', method: 'POST', mode: 'timeout', times: 1, hangMs: HANG_MS });

    const key = { idempotencyKey: `nk-return-${pi.id}` };
    const first = await noRetries.paymentIntents.capture(pi.id, { amount_to_capture: 2_000 }, key).catch((e: unknown) => e);
    expect(first).toBeInstanceOf(Stripe.errors.StripeConnectionError);
    // The provider applied it even though the client never heard back.
    expect((await noRetries.paymentIntents.retrieve(pi.id)).status).toBe('succeeded');

    const retried = await noRetries.paymentIntents.capture(pi.id, { amount_to_capture: 2_000 }, key);
    expect(retried).toMatchObject({ status: 'succeeded', amount_received: 2_000 });
    expect(retried.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(await eventsFor(noRetries, 'payment_intent.succeeded', pi.id)).toHaveLength(1);
  });

  // https://docs.stripe.com/api/errors (api_error, HTTP 500): nothing applied, retried by the SDK.
  it('answers 500 in the provider error shape, applying nothing', async () => {
    const noRetries = sdk({ maxNetworkRetries: 0 });
    const pi = await hold(noRetries, 5_000);
    await fault({ path: '/v1/payment_intents/:id/capture', mode: '500', times: 1 });
    const error = (await noRetries.paymentIntents.capture(pi.id).catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(error).toBeInstanceOf(Stripe.errors.StripeAPIError);
    expect(error.statusCode).toBe(500);
    expect(error.raw).toMatchObject({ type: 'api_error' });
    expect((await noRetries.paymentIntents.retrieve(pi.id)).status).toBe('requires_capture');

    // With retries the SDK gets through on the next attempt.
    await fault({ path: '/v1/payment_intents/:id/capture', mode: '500', times: 1 });
    const retrying = sdk({ maxNetworkRetries: 2 });
    expect((await retrying.paymentIntents.capture(pi.id)).status).toBe('succeeded');
  });

  // https://docs.stripe.com/declines (card_error, card_declined) forced on a good card.
  it('declines the next confirmation on demand, then behaves again', async () => {
    const stripe = sdk({ maxNetworkRetries: 0 });
    await fault({ path: '/v1/payment_intents/:id/confirm', mode: 'decline', times: 1, declineCode: 'insufficient_funds' });
    const pi = await stripe.paymentIntents.create({ amount: 3_000, currency: 'gbp', payment_method: 'pm_card_visa', capture_method: 'manual' });
    const error = (await stripe.paymentIntents.confirm(pi.id).catch((e: unknown) => e)) as Stripe.errors.StripeCardError;
    expect(error).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(error.statusCode).toBe(402);
    expect(error.decline_code).toBe('insufficient_funds');
    expect(await eventsFor(stripe, 'payment_intent.payment_failed', pi.id)).toHaveLength(1);
    const again = await stripe.paymentIntents.confirm(pi.id, { payment_method: 'pm_card_visa' });
    expect(again.status).toBe('requires_capture');

    // On a path that authorizes nothing, the decline is answered without applying it.
    await fault({ path: '/v1/refunds', mode: 'decline', times: 1 });
    const captured = await stripe.paymentIntents.capture(pi.id);
    const refundError = (await stripe.refunds.create({ payment_intent: captured.id }).catch((e: unknown) => e)) as Stripe.errors.StripeCardError;
    expect(refundError).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect((await stripe.refunds.list({ payment_intent: captured.id })).data).toHaveLength(0);
  });

  it('lists and clears pending faults, and validates the control body', async () => {
    const base = `http://127.0.0.1:${fake.port}/__fake/faults`;
    await fault({ path: '/v1/customers', mode: '500', times: 3 });
    const listed = (await (await fetch(base)).json()) as { data: Array<{ path: string; remaining: number }> };
    expect(listed.data).toEqual([expect.objectContaining({ path: '/v1/customers', remaining: 3 })]);
    await fetch(base, { method: 'DELETE' });
    expect(((await (await fetch(base)).json()) as { data: unknown[] }).data).toEqual([]);
    const bad = await fetch(base, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ path: '/v1/x', mode: 'explode' }),
    });
    expect(bad.status).toBe(400);
  });
});
