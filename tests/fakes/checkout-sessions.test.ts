import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createPaymentClient } from '../../server/billing/payment-client';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payment-fake';
import { eventTable } from '../../server/fakes/payments/events';

const SECRET_KEY = 'sk_test_nestkeeper_checkout';

let fake: PaymentFake;
let stripe: Stripe;
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
afterAll(() => fake?.close());

const session = async (key: string, extra: Partial<Stripe.Checkout.SessionCreateParams> = {}) =>
  stripe.checkout.sessions.create(
    {
      mode: 'payment',
      customer: (await stripe.customers.create({ name: 'Quarrel Fixtures' })).id,
      line_items: [{ quantity: 1, price_data: { currency: 'eur', unit_amount: 40_000, product_data: { name: 'Deposit for rental R-0042' } } }],
      payment_intent_data: { capture_method: 'manual', setup_future_usage: 'off_session', metadata: { purpose: 'deposit' } },
      success_url: 'http://127.0.0.1:9/back?session={CHECKOUT_SESSION_ID}',
      cancel_url: 'http://127.0.0.1:9/back?left=1',
      ...extra,
    },
    { idempotencyKey: key },
  );
const pay = (url: string, cardNumber: string) =>
  fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ cardNumber, expiry: '11/33', cvc: '424' }),
  });
describe('payment-provider fake: Checkout Sessions as the SDK calls them', () => {
  it('creates an open session with a hosted page, 24 hours by default; a replay under the same key answers the same session', async () => {
    const created = await session('checkout-a');
    expect(created).toMatchObject({ object: 'checkout.session', status: 'open', mode: 'payment', amount_total: 40_000, currency: 'eur', payment_intent: null });
    expect(created.url).toBe(`http://127.0.0.1:${fake.port}/pay/${created.id}`);
    // Create reference, expires_at: "By default, this value is 24 hours from creation."
    expect(created.expires_at - created.created).toBe(24 * 3600);
    const page = await (await fetch(created.url!)).text();
    for (const label of ['Card number', 'Expiry', 'CVC']) expect(page).toContain(`>${label}</label>`);
    expect(page).toContain('€400.00');
    const replay = await stripe.checkout.sessions.create(
      {
        mode: 'payment',
        customer: created.customer as string,
        line_items: [{ quantity: 1, price_data: { currency: 'eur', unit_amount: 40_000, product_data: { name: 'Deposit for rental R-0042' } } }],
        payment_intent_data: { capture_method: 'manual', setup_future_usage: 'off_session', metadata: { purpose: 'deposit' } },
        success_url: 'http://127.0.0.1:9/back?session={CHECKOUT_SESSION_ID}',
        cancel_url: 'http://127.0.0.1:9/back?left=1',
      },
      { idempotencyKey: 'checkout-a' },
    );
    expect(replay.id).toBe(created.id);
    await expect(session('checkout-b', { expires_at: Math.floor(Date.now() / 1000) + 600 })).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      param: 'expires_at',
    });
  });

  it('the approving test card authorizes with manual capture, saves the card, completes the session and redirects with its id', async () => {
    const created = await session('checkout-c');
    const paid = await pay(created.url!, '4242 4242 4242 4242');
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`http://127.0.0.1:9/back?session=${created.id}`);
    const done = await stripe.checkout.sessions.retrieve(created.id, { expand: ['payment_intent', 'payment_intent.latest_charge'] });
    expect(done.status).toBe('complete');
    const intent = done.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({ status: 'requires_capture', capture_method: 'manual', amount_capturable: 40_000, setup_future_usage: 'off_session' });
    expect((intent.latest_charge as Stripe.Charge).payment_method_details?.card?.last4).toBe('4242');
    const card = await stripe.paymentMethods.retrieve(intent.payment_method as string);
    expect(card.customer).toBe(created.customer);
    const types = [...eventTable(fake.store).values()]
      .filter((e) => (e.data.object as { id: string }).id === created.id || (e.data.object as { id: string }).id === intent.id)
      .map((e) => e.type);
    expect(types).toEqual(expect.arrayContaining(['payment_intent.amount_capturable_updated', 'checkout.session.completed']));
    expect(types.indexOf('checkout.session.completed')).toBeGreaterThan(types.indexOf('payment_intent.amount_capturable_updated'));
    expect((await pay(created.url!, '4242424242424242')).status).toBe(409);
  });

  it('declines 4000 0000 0000 0002 and 4000 0000 0000 9995 on the page, which stays open for another card', async () => {
    const created = await session('checkout-d');
    const declined = await pay(created.url!, '4000000000000002');
    expect(declined.status).toBe(402);
    expect(await declined.text()).toContain('Your card was declined.');
    const poor = await pay(created.url!, '4000 0000 0000 9995');
    expect(await poor.text()).toContain('Your card has insufficient funds.');
    const open = await stripe.checkout.sessions.retrieve(created.id, { expand: ['payment_intent'] });
    expect(open.status).toBe('open');
    const intent = open.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({ status: 'requires_payment_method', last_payment_error: { decline_code: 'insufficient_funds' } });
    expect(
      [...eventTable(fake.store).values()].filter((e) => e.type === 'payment_intent.payment_failed' && (e.data.object as { id: string }).id === intent.id),
    ).toHaveLength(2);
    expect((await pay(created.url!, '4242424242424242')).status).toBe(303);
  });

  it('expires on request and when its time is up, with checkout.session.expired; an expired page takes no card', async () => {
    const first = await session('checkout-e');
    const expired = await stripe.checkout.sessions.expire(first.id, {}, { idempotencyKey: 'checkout-e:expire' });
    expect(expired).toMatchObject({ status: 'expired', url: null });
    await expect(stripe.checkout.sessions.expire(first.id, {}, { idempotencyKey: 'checkout-e:expire-again' })).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
    });
    const second = await session('checkout-f');
    await fetch(`http://127.0.0.1:${fake.port}/__fake/clock`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ advanceSeconds: 24 * 3600 }),
    });
    expect((await stripe.checkout.sessions.retrieve(second.id)).status).toBe('expired');
    expect((await pay(first.url!, '4242424242424242')).status).toBe(409);
    const kinds = [...eventTable(fake.store).values()].filter((e) => e.type === 'checkout.session.expired').map((e) => (e.data.object as { id: string }).id);
    expect(kinds).toEqual(expect.arrayContaining([first.id, second.id]));
  });
});
