import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createPaymentClient } from '../../server/billing/payment-client';
import { PaymentGateway } from '../../server/billing/payment-gateway';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payment-fake';
import { AppError } from '../../server/http/errors';

/**
 * Amounts in currencies whose decimals differ between ISO 4217 and the
 * provider (docs.stripe.com/currencies: zero-decimal list, three-decimal
 * currencies, special cases), through the gateway and the official SDK to the
 * local fake and back.
 */
describe('deposit amounts in the provider’s units, against the payment fake', () => {
  let fake: PaymentFake;
  let stripe: Stripe;
  let gateway: PaymentGateway;
  let n = 0;

  beforeAll(async () => {
    fake = await startPaymentFake({ port: 0 });
    stripe = createPaymentClient({
      PAYMENT_API_KEY: 'sk_test_nestkeeper',
      PAYMENT_API_HOST: '127.0.0.1',
      PAYMENT_API_PORT: fake.port,
      PAYMENT_API_PROTOCOL: 'http',
      PAYMENT_TIMEOUT_MS: 15_000,
    });
    gateway = new PaymentGateway(stripe);
  });
  afterAll(async () => {
    await fake.close();
  });

  const holdOf = async (amountMinor: number, currency: string) => {
    n += 1;
    const customer = await gateway.ensureCustomer({ id: `c-${n}`, company: 'Tarnwick Survey Co', billingEmail: `desk${n}@tarnwick.test` });
    const pm = await stripe.paymentMethods.create({ type: 'card', card: { token: 'tok_visa' } });
    const card = await gateway.saveCard(pm.id, customer, `card:${n}`);
    return gateway.confirmIntent({
      amountMinor,
      currency,
      customer,
      paymentMethod: card,
      capture: 'manual',
      offSession: false,
      description: 'Deposit',
      metadata: {},
      key: `hold:${n}`,
    });
  };

  it.each([
    // [currency, ISO minor units held, provider amount on the intent, ISO minor units captured]
    ['EUR', 50_000, 50_000, 12_345],
    ['JPY', 50_000, 50_000, 1_234], // zero-decimal both sides
    ['HUF', 5_000_000, 5_000_000, 123_456], // 50 000.00 Ft: charged with two decimals, not 100× too little
    ['ISK', 50_000, 5_000_000, 1_234], // 50 000 kr: sent with two decimals
    ['KWD', 150_000, 150_000, 12_340], // 150.000 KWD; 12.340 captured
    ['MGA', 5_000_000, 50_000, 123_400], // Ar 50 000.00: whole ariary at the provider
    ['IQD', 5_000_000, 500_000, 123_450], // 5 000.000 IQD: two decimals at the provider
  ])('%s: holds %i minor units as amount %i and captures %i minor units', async (currency, minor, providerAmount, capture) => {
    const held = await holdOf(minor, currency);
    expect(held).toMatchObject({ ok: true, status: 'requires_capture', amountMinor: minor });
    if (!held.ok) return;
    expect((await stripe.paymentIntents.retrieve(held.id)).amount).toBe(providerAmount);
    const captured = await gateway.capture(held.id, capture, currency, `hold:${n}:capture`);
    expect(captured).toMatchObject({ ok: true, status: 'succeeded', capturedMinor: capture });
  });

  it('refuses, before calling the provider, an amount finer than the provider takes (422 naming the step)', async () => {
    const refused = await holdOf(150_005, 'KWD').catch((err: unknown) => err);
    expect(refused).toBeInstanceOf(AppError);
    expect(refused).toMatchObject({ status: 422, code: 'amount_not_accepted' });
    expect((refused as AppError).message).toMatch(/steps of KWD\s0\.010/);
  });

  // The fake holds the provider's rules of its own: what a careless client would send is refused.
  it('the fake refuses a three-decimal amount not ending in 0, and fractional króna (docs.stripe.com/currencies)', async () => {
    const create = (amount: number, currency: string) =>
      stripe.paymentIntents.create({ amount, currency, payment_method: 'pm_card_visa', capture_method: 'manual', confirm: true });
    await expect(create(5_124, 'kwd')).rejects.toMatchObject({ type: 'StripeInvalidRequestError', param: 'amount' });
    await expect(create(550, 'isk')).rejects.toMatchObject({ type: 'StripeInvalidRequestError', code: 'invalid_charge_amount_no_decimal_compatible' });
    expect((await create(5_120, 'kwd')).status).toBe('requires_capture');
    const pi = await create(500, 'isk');
    await expect(stripe.paymentIntents.capture(pi.id, { amount_to_capture: 250 })).rejects.toMatchObject({ param: 'amount_to_capture' });
  });
});
