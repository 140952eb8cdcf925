import { createServer, type IncomingHttpHeaders, type Server } from 'node:http';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createPaymentClient } from '../../server/billing/payment-client';
import { listen } from '../../server/fakes/listen';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payment-fake';
import { waitUntil } from '../support/eventually';

const SECRET_KEY = 'sk_test_nestkeeper';
const WEBHOOK_SECRET = 'whsec_nestkeeper_fake_signing_secret';

type Delivery = { body: string; headers: IncomingHttpHeaders; answered: number };

/** A loopback endpoint that records raw bodies; `failFirst` answers 500 that many times. */
async function startReceiver(failFirst = 0) {
  const deliveries: Delivery[] = [];
  let failuresLeft = failFirst;
  const server: Server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const answered = failuresLeft > 0 ? 500 : 200;
      if (failuresLeft > 0) failuresLeft -= 1;
      deliveries.push({ body: Buffer.concat(chunks).toString('utf8'), headers: req.headers, answered });
      res.writeHead(answered, { 'Content-Type': 'application/json' }).end('{}');
    });
  });
  const port = await listen(server, 0, '127.0.0.1');
  return {
    url: `http://127.0.0.1:${port}/webhooks/payments`,
    deliveries,
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}

const eventOf = (d: Delivery) => JSON.parse(d.body) as Stripe.Event;

describe('payment-provider fake: signed webhooks and events', () => {
  let receiver: Awaited<ReturnType<typeof startReceiver>>;
  let fake: PaymentFake;
  let stripe: Stripe;

  beforeAll(async () => {
    receiver = await startReceiver();
    fake = await startPaymentFake({ port: 0, webhookUrl: receiver.url, webhookSecret: WEBHOOK_SECRET, webhookRetryDelaysMs: [50, 100, 200] });
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
    await receiver.close();
  });

  const delivered = (type: string, objectId: string) =>
    waitUntil(`${type} for ${objectId}`, () =>
      receiver.deliveries.find((d) => {
        const e = eventOf(d);
        return e.type === type && (e.data.object as { id: string }).id === objectId;
      }),
    );

  // https://docs.stripe.com/api/events/types and https://docs.stripe.com/webhooks#verify-manually
  it('emits each state change as an event the SDK’s constructEvent accepts', async () => {
    const pm = await stripe.paymentMethods.create({ type: 'card', card: { token: 'tok_visa' } });
    const pi = await stripe.paymentIntents.create({ amount: 18_000, currency: 'gbp', payment_method: pm.id, capture_method: 'manual', confirm: true });
    await stripe.paymentIntents.capture(pi.id, { amount_to_capture: 6_000 });
    await stripe.refunds.create({ payment_intent: pi.id, amount: 2_500 });

    const released = await stripe.paymentIntents.create({
      amount: 5_000,
      currency: 'gbp',
      payment_method: 'pm_card_mastercard',
      capture_method: 'manual',
      confirm: true,
    });
    await stripe.paymentIntents.cancel(released.id);

    const declined = await stripe.paymentIntents.create({
      amount: 5_000,
      currency: 'gbp',
      payment_method: 'pm_card_chargeDeclinedInsufficientFunds',
      capture_method: 'manual',
    });
    await stripe.paymentIntents.confirm(declined.id).catch(() => undefined);

    const expectations: Array<[string, string, (e: Stripe.Event) => void]> = [
      [
        'payment_intent.amount_capturable_updated',
        pi.id,
        (e) => expect(e.data.object).toMatchObject({ status: 'requires_capture', amount_capturable: 18_000 }),
      ],
      ['payment_intent.succeeded', pi.id, (e) => expect(e.data.object).toMatchObject({ status: 'succeeded', amount_received: 6_000, amount_capturable: 0 })],
      ['charge.refunded', pi.latest_charge as string, (e) => expect(e.data.object).toMatchObject({ amount_refunded: 2_500, amount_captured: 6_000 })],
      ['payment_intent.canceled', released.id, (e) => expect(e.data.object).toMatchObject({ status: 'canceled' })],
      [
        'payment_intent.payment_failed',
        declined.id,
        (e) => expect((e.data.object as Stripe.PaymentIntent).last_payment_error).toMatchObject({ decline_code: 'insufficient_funds' }),
      ],
    ];
    for (const [type, objectId, check] of expectations) {
      const d = await delivered(type, objectId);
      const header = d.headers['stripe-signature'] as string;
      expect(header).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
      expect(d.headers['content-type']).toMatch(/^application\/json/);
      const event = stripe.webhooks.constructEvent(d.body, header, WEBHOOK_SECRET);
      expect(event).toMatchObject({ object: 'event', type, livemode: false });
      expect(event.id).toMatch(/^evt_/);
      check(event);
      // The same event is retrievable (https://docs.stripe.com/api/events/retrieve).
      const fetched = await stripe.events.retrieve(event.id);
      expect(fetched).toMatchObject({ id: event.id, type, pending_webhooks: 0 });
    }

    // https://docs.stripe.com/api/events/list
    const succeeded = await stripe.events.list({ type: 'payment_intent.succeeded' });
    expect(succeeded.data.every((e) => e.type === 'payment_intent.succeeded')).toBe(true);
    expect(succeeded.data.some((e) => (e.data.object as Stripe.PaymentIntent).id === pi.id)).toBe(true);
    const piEvents = await stripe.events.list({ type: 'payment_intent.*', limit: 100 });
    expect(piEvents.data.length).toBeGreaterThanOrEqual(4);
    const missing = (await stripe.events.retrieve('evt_nope').catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(missing.code).toBe('resource_missing');
  });

  // https://docs.stripe.com/webhooks#verify-manually (signature over "<t>.<payload>"; timestamp tolerance, 300 s by default in the SDK)
  it('is rejected by constructEvent when the payload is tampered with or the timestamp is stale', async () => {
    const before = Math.floor(Date.now() / 1000);
    const pi = await stripe.paymentIntents.create({ amount: 7_700, currency: 'gbp', payment_method: 'pm_card_visa', capture_method: 'manual', confirm: true });
    const d = await delivered('payment_intent.amount_capturable_updated', pi.id);
    const header = d.headers['stripe-signature'] as string;
    const signedAt = Number(/t=(\d+)/.exec(header)![1]);
    // Signed at delivery, in Unix seconds: between the request and its arrival, however slow the machine.
    expect(signedAt).toBeGreaterThanOrEqual(before);
    expect(signedAt).toBeLessThanOrEqual(Math.ceil(Date.now() / 1000));

    const tampered = d.body.replace('"amount_capturable": 7700', '"amount_capturable": 770000');
    expect(tampered).not.toBe(d.body);
    expect(() => stripe.webhooks.constructEvent(tampered, header, WEBHOOK_SECRET)).toThrow(Stripe.errors.StripeSignatureVerificationError);
    expect(() => stripe.webhooks.constructEvent(d.body, header, 'whsec_someone_else')).toThrow(Stripe.errors.StripeSignatureVerificationError);

    // Within the SDK's default tolerance it verifies; just past it, it is stale.
    const at = (secondsAfterSigning: number) => (signedAt + secondsAfterSigning) * 1000;
    expect(stripe.webhooks.constructEvent(d.body, header, WEBHOOK_SECRET, undefined, undefined, at(299)).type).toBe('payment_intent.amount_capturable_updated');
    expect(() => stripe.webhooks.constructEvent(d.body, header, WEBHOOK_SECRET, undefined, undefined, at(301))).toThrow(/Timestamp outside the tolerance zone/);
  });
});

describe('payment-provider fake: webhook retries', () => {
  // https://docs.stripe.com/webhooks#retries — re-delivered with backoff until answered 2xx.
  it('re-delivers an event after non-2xx answers, each attempt freshly signed', async () => {
    const receiver = await startReceiver(2);
    const fake = await startPaymentFake({ port: 0, webhookUrl: receiver.url, webhookSecret: WEBHOOK_SECRET, webhookRetryDelaysMs: [30, 60, 120] });
    try {
      const stripe = createPaymentClient({
        PAYMENT_API_KEY: SECRET_KEY,
        PAYMENT_API_HOST: '127.0.0.1',
        PAYMENT_API_PORT: fake.port,
        PAYMENT_API_PROTOCOL: 'http',
        PAYMENT_TIMEOUT_MS: 15_000,
      });
      const pi = await stripe.paymentIntents.create({ amount: 1_000, currency: 'gbp' });
      const event = (await stripe.events.list({ type: 'payment_intent.created' })).data[0]!;
      expect((event.data.object as Stripe.PaymentIntent).id).toBe(pi.id);

      await waitUntil('a successful delivery', () => receiver.deliveries.find((d) => d.answered === 200));
      const attempts = receiver.deliveries.filter((d) => eventOf(d).id === event.id);
      expect(attempts.map((d) => d.answered)).toEqual([500, 500, 200]);
      for (const d of attempts) {
        expect(stripe.webhooks.constructEvent(d.body, d.headers['stripe-signature'] as string, WEBHOOK_SECRET).id).toBe(event.id);
      }
      expect((await stripe.events.retrieve(event.id)).pending_webhooks).toBe(0);

      const log = (await (await fetch(`http://127.0.0.1:${fake.port}/__fake/webhooks`)).json()) as {
        data: Array<{ event: string; attempt: number; status: number }>;
      };
      expect(log.data.filter((a) => a.event === event.id).map((a) => [a.attempt, a.status])).toEqual([
        [1, 500],
        [2, 500],
        [3, 200],
      ]);
    } finally {
      await fake.close();
      await receiver.close();
    }
  });

  it('sends nothing when no endpoint is configured, but still records events', async () => {
    const fake = await startPaymentFake({ port: 0 });
    try {
      const stripe = createPaymentClient({
        PAYMENT_API_KEY: SECRET_KEY,
        PAYMENT_API_HOST: '127.0.0.1',
        PAYMENT_API_PORT: fake.port,
        PAYMENT_API_PROTOCOL: 'http',
        PAYMENT_TIMEOUT_MS: 15_000,
      });
      await stripe.paymentIntents.create({ amount: 1_000, currency: 'gbp', payment_method: 'pm_card_visa', capture_method: 'manual', confirm: true });
      const list = await stripe.events.list();
      expect(list.data.map((e) => e.type)).toContain('payment_intent.amount_capturable_updated');
      expect(list.data.every((e) => e.pending_webhooks === 0)).toBe(true);
    } finally {
      await fake.close();
    }
  });
});
