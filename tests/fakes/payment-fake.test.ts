import Stripe from 'stripe';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createPaymentClient } from '../../server/billing/payment-client';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payment-fake';

const SECRET_KEY = 'sk_test_nestkeeper';

describe('payment-provider fake, driven by the official SDK', () => {
  let fake: PaymentFake;
  let stripe: Stripe;

  beforeAll(async () => {
    fake = await startPaymentFake({ port: 0 });
    // The app's own client factory, pointed at the fake by host, port and protocol.
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

  it('binds loopback on a free port when asked for port 0', () => {
    expect(fake.host).toBe('127.0.0.1');
    expect(fake.port).toBeGreaterThan(0);
  });

  it('answers the health probe without a key', async () => {
    const res = await request(fake.app).get('/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok' });
  });

  it('creates a customer and retrieves it by id', async () => {
    const before = Math.floor(Date.now() / 1000);
    const created = await stripe.customers.create({
      email: 'billing@kestrel-survey.test',
      name: 'Kestrel Survey Works',
      metadata: { organizationId: 'org-1', customerRef: 'C-0042' },
    });
    expect(created.id).toMatch(/^cus_[A-Za-z0-9]{24}$/);
    expect(created).toMatchObject({
      object: 'customer',
      email: 'billing@kestrel-survey.test',
      name: 'Kestrel Survey Works',
      metadata: { organizationId: 'org-1', customerRef: 'C-0042' },
      livemode: false,
    });
    // Unix seconds, stamped while the request ran.
    expect(created.created).toBeGreaterThanOrEqual(before);
    expect(created.created).toBeLessThanOrEqual(Math.ceil(Date.now() / 1000));

    const fetched = await stripe.customers.retrieve(created.id);
    expect(fetched).toMatchObject({ id: created.id, email: created.email, name: created.name, metadata: created.metadata });
    expect(fetched.lastResponse.requestId).toMatch(/^req_/);
  });

  it('updates metadata key by key and removes a key sent empty', async () => {
    const c = await stripe.customers.create({ name: 'Harrow Lane Fabrication', metadata: { a: '1', b: '2' } });
    const updated = await stripe.customers.update(c.id, { email: 'ap@harrow-lane.test', metadata: { b: '', c: '3' } });
    expect(updated.metadata).toEqual({ a: '1', c: '3' });
    expect(updated.email).toBe('ap@harrow-lane.test');
    expect(updated.name).toBe('Harrow Lane Fabrication');
  });

  it('lists customers filtered by email, newest first', async () => {
    const first = await stripe.customers.create({ email: 'dup@ferncombe.test', name: 'Ferncombe one' });
    const second = await stripe.customers.create({ email: 'dup@ferncombe.test', name: 'Ferncombe two' });
    const page = await stripe.customers.list({ email: 'dup@ferncombe.test', limit: 1 });
    expect(page.data.map((c) => c.id)).toEqual([second.id]);
    expect(page.has_more).toBe(true);
    const all = await stripe.customers.list({ email: 'dup@ferncombe.test' }).autoPagingToArray({ limit: 10 });
    expect(all.map((c) => c.id)).toEqual([second.id, first.id]);
  });

  it('reports an unknown customer as resource_missing through StripeError', async () => {
    const error = await stripe.customers.retrieve('cus_doesnotexist').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Stripe.errors.StripeError);
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    const e = error as Stripe.errors.StripeError;
    expect(e.statusCode).toBe(404);
    expect(e.code).toBe('resource_missing');
    expect(e.param).toBe('id');
  });

  it('rejects an unknown parameter with parameter_unknown', async () => {
    const error = (await stripe.customers
      .create({ name: 'x', colour: 'brass' } as Stripe.CustomerCreateParams)
      .catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error.code).toBe('parameter_unknown');
    expect(error.param).toBe('colour');
  });

  it('replays the first response for a repeated Idempotency-Key', async () => {
    const params = { email: 'once@moorgate-optics.test', name: 'Moorgate Optics' };
    const first = await stripe.customers.create(params, { idempotencyKey: 'nk-test-create-1' });
    const again = await stripe.customers.create(params, { idempotencyKey: 'nk-test-create-1' });
    expect(again.id).toBe(first.id);
    expect(again.lastResponse.headers['idempotent-replayed']).toBe('true');
    const other = await stripe.customers.create(params, { idempotencyKey: 'nk-test-create-2' });
    expect(other.id).not.toBe(first.id);
  });

  it('refuses the same Idempotency-Key with different parameters', async () => {
    await stripe.customers.create({ name: 'Alder Row' }, { idempotencyKey: 'nk-test-mismatch' });
    const error = (await stripe.customers
      .create({ name: 'Someone else' }, { idempotencyKey: 'nk-test-mismatch' })
      .catch((e: unknown) => e)) as Stripe.errors.StripeError;
    expect(error).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });

  it('does not keep a validation failure under an Idempotency-Key', async () => {
    const bad = await stripe.customers
      .create({ name: 'Wrenfield', bogus: '1' } as Stripe.CustomerCreateParams, { idempotencyKey: 'nk-test-bad-then-good' })
      .catch((e: unknown) => e);
    expect(bad).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    const good = await stripe.customers.create({ name: 'Wrenfield' }, { idempotencyKey: 'nk-test-bad-then-good' });
    expect(good.id).toMatch(/^cus_/);
    expect(good.lastResponse.headers['idempotent-replayed']).toBeUndefined();
  });

  it('requires a test-mode secret key, answering 401 in the provider shape', async () => {
    const none = await request(fake.app).get('/v1/customers/cus_x');
    expect(none.status).toBe(401);
    expect(none.body.error.type).toBe('invalid_request_error');
    expect(typeof none.body.error.message).toBe('string');

    const live = await request(fake.app).get('/v1/customers/cus_x').set('Authorization', 'Bearer sk_live_abc');
    expect(live.status).toBe(401);

    const sdkWithBadKey = new Stripe('pk_test_wrong', { host: '127.0.0.1', port: fake.port, protocol: 'http' });
    await expect(sdkWithBadKey.customers.retrieve('cus_x')).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
  });

  it('answers unknown routes with a provider-shaped 404', async () => {
    const res = await request(fake.app).get('/v1/nothing-here').set('Authorization', `Bearer ${SECRET_KEY}`);
    expect(res.status).toBe(404);
    expect(res.body.error.type).toBe('invalid_request_error');
  });
});

describe('payment-provider fake lifecycle', () => {
  it('accepts only the configured key when started with one, and frees its port on close', async () => {
    const fake = await startPaymentFake({ port: 0, apiKey: 'sk_test_only_this' });
    const ok = new Stripe('sk_test_only_this', { host: '127.0.0.1', port: fake.port, protocol: 'http' });
    const wrong = new Stripe('sk_test_another', { host: '127.0.0.1', port: fake.port, protocol: 'http' });
    await expect(ok.customers.create({ name: 'Tarn Metrology' })).resolves.toMatchObject({ object: 'customer' });
    await expect(wrong.customers.create({ name: 'x' })).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    const port = fake.port;
    await fake.close();
    const again = await startPaymentFake({ port });
    expect(again.port).toBe(port);
    await again.close();
  });
});
