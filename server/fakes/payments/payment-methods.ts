import { Router } from 'express';
import { z } from 'zod';
import { causeOf, emitEvent } from './events';
import { invalidRequest, resourceMissing, stateError } from './errors';
import { findCustomer } from './customers';
import { applyMetadata, common, listPage, listParams, metadataParam, parseParams, type Metadata } from './params';
import type { PaymentResource } from './resource';
import type { PaymentStore } from './store';

/** How a test card behaves when a payment on it is confirmed. */
export type CardOutcome = { kind: 'approve' } | { kind: 'decline'; declineCode: 'generic_decline' | 'insufficient_funds' };

type TestCard = { brand: 'visa' | 'mastercard'; last4: string; outcome: CardOutcome };

/**
 * The published test tokens this fake knows (https://docs.stripe.com/testing#cards
 * and #declined-payments): tok_visa (…4242) and tok_mastercard (…4444) succeed;
 * tok_chargeDeclined (…0002) declines with `generic_decline` and
 * tok_chargeDeclinedInsufficientFunds (…9995) with `insufficient_funds` — both
 * at confirmation, not when the payment method is created.
 */
const TEST_TOKENS: Record<string, TestCard> = {
  tok_visa: { brand: 'visa', last4: '4242', outcome: { kind: 'approve' } },
  tok_mastercard: { brand: 'mastercard', last4: '4444', outcome: { kind: 'approve' } },
  tok_chargeDeclined: { brand: 'visa', last4: '0002', outcome: { kind: 'decline', declineCode: 'generic_decline' } },
  tok_chargeDeclinedInsufficientFunds: {
    brand: 'visa',
    last4: '9995',
    outcome: { kind: 'decline', declineCode: 'insufficient_funds' },
  },
};

/** PaymentMethod object (card only), https://docs.stripe.com/api/payment_methods/object. */
export type PaymentMethod = {
  id: string;
  object: 'payment_method';
  allow_redisplay: 'unspecified';
  billing_details: {
    address: { city: null; country: null; line1: null; line2: null; postal_code: null; state: null };
    email: string | null;
    name: string | null;
    phone: string | null;
  };
  card: {
    brand: string;
    checks: { address_line1_check: null; address_postal_code_check: null; cvc_check: 'unchecked' };
    country: string;
    display_brand: string;
    exp_month: number;
    exp_year: number;
    fingerprint: string;
    funding: 'credit';
    generated_from: null;
    last4: string;
    networks: { available: string[]; preferred: null };
    three_d_secure_usage: { supported: true };
    wallet: null;
  };
  created: number;
  customer: string | null;
  livemode: false;
  metadata: Metadata;
  type: 'card';
};

/**
 * The published test card numbers (https://docs.stripe.com/testing#cards and
 * #declined-payments) as typed on the hosted payment page, each the same card
 * as its token above.
 */
export const TEST_CARD_NUMBERS: Record<string, keyof typeof TEST_TOKENS> = {
  '4242424242424242': 'tok_visa',
  '5555555555554444': 'tok_mastercard',
  '4000000000000002': 'tok_chargeDeclined',
  '4000000000009995': 'tok_chargeDeclinedInsufficientFunds',
};

export const paymentMethodTable = (store: PaymentStore) => store.table<PaymentMethod>('payment_methods');
/** Internal: which test card each payment method came from (never sent to clients). */
const outcomeTable = (store: PaymentStore) => store.table<CardOutcome>('payment_method_outcomes');

export function createFromToken(store: PaymentStore, token: string, billing: BillingParams | undefined, metadata: Metadata): PaymentMethod {
  const card = TEST_TOKENS[token];
  if (!card) {
    throw invalidRequest(`No such token: '${token}'. This payment fake knows the test tokens ${Object.keys(TEST_TOKENS).join(', ')}.`, {
      code: 'resource_missing',
      param: 'card[token]',
    });
  }
  const createdYear = new Date(store.clock()).getUTCFullYear();
  const pm: PaymentMethod = {
    id: store.newId('pm'),
    object: 'payment_method',
    allow_redisplay: 'unspecified',
    billing_details: {
      address: { city: null, country: null, line1: null, line2: null, postal_code: null, state: null },
      email: billing?.email || null,
      name: billing?.name || null,
      phone: billing?.phone || null,
    },
    card: {
      brand: card.brand,
      checks: { address_line1_check: null, address_postal_code_check: null, cvc_check: 'unchecked' },
      country: 'US',
      display_brand: card.brand,
      // Invented expiry, a few years ahead of the fake's clock.
      exp_month: 12,
      exp_year: createdYear + 3,
      fingerprint: `fp${card.brand}${card.last4}`.padEnd(16, '0').slice(0, 16),
      funding: 'credit',
      generated_from: null,
      last4: card.last4,
      networks: { available: [card.brand], preferred: null },
      three_d_secure_usage: { supported: true },
      wallet: null,
    },
    created: store.nowSeconds(),
    customer: null,
    livemode: false,
    metadata,
    type: 'card',
  };
  paymentMethodTable(store).set(pm.id, pm);
  outcomeTable(store).set(pm.id, card.outcome);
  return pm;
}

/** The card outcome a confirmation on this payment method gets. */
export function cardOutcome(store: PaymentStore, pmId: string): CardOutcome {
  return outcomeTable(store).get(pmId) ?? { kind: 'approve' };
}

/**
 * A payment method by id, for intents. In test mode the provider also accepts the
 * published `pm_card_*` ids directly (https://docs.stripe.com/testing#cards), e.g.
 * `pm_card_visa`; each use makes a fresh payment method from the matching token.
 */
export function resolvePaymentMethod(store: PaymentStore, id: string, param = 'payment_method'): PaymentMethod {
  const existing = paymentMethodTable(store).get(id);
  if (existing) return existing;
  const shortcut = /^pm_card_(\w+)$/.exec(id);
  if (shortcut && TEST_TOKENS[`tok_${shortcut[1]}`]) return createFromToken(store, `tok_${shortcut[1]}`, undefined, {});
  throw resourceMissing('payment_method', id, param);
}

const billingSchema = z
  .strictObject({
    email: z.string().optional(),
    name: z.string().optional(),
    phone: z.string().optional(),
  })
  .optional();
type BillingParams = z.infer<typeof billingSchema>;

const createSchema = z.strictObject({
  ...common,
  type: z.literal('card'),
  // Raw card numbers are not accepted; only the published test tokens.
  card: z.strictObject({ token: z.string() }),
  billing_details: billingSchema,
  metadata: metadataParam,
});
const attachSchema = z.strictObject({ ...common, customer: z.string() });
const detachSchema = z.strictObject(common);
const retrieveSchema = z.strictObject(common);
const listSchema = z.strictObject({ ...common, ...listParams, customer: z.string().optional(), type: z.literal('card').optional() });

export const paymentMethods: PaymentResource = {
  name: 'payment_methods',
  router(store) {
    const router = Router();
    const table = paymentMethodTable(store);
    const find = (id: string) => {
      const pm = table.get(id);
      if (!pm) throw resourceMissing('payment_method', id, 'id');
      return pm;
    };

    // https://docs.stripe.com/api/payment_methods/create
    router.post('/v1/payment_methods', (req, res) => {
      const p = parseParams(createSchema, req.body);
      res.json(createFromToken(store, p.card.token, p.billing_details, applyMetadata({}, p.metadata)));
    });

    // https://docs.stripe.com/api/payment_methods/list (customer's cards)
    router.get('/v1/payment_methods', (req, res) => {
      const p = parseParams(listSchema, req.query);
      if (p.customer) findCustomer(store, p.customer);
      const all = [...table.values()].filter((pm) => p.customer === undefined || pm.customer === p.customer);
      res.json(listPage('/v1/payment_methods', all, p));
    });

    // https://docs.stripe.com/api/payment_methods/retrieve
    router.get('/v1/payment_methods/:id', (req, res) => {
      parseParams(retrieveSchema, req.query);
      res.json(find(req.params.id));
    });

    // https://docs.stripe.com/api/payment_methods/attach — a payment method
    // belongs to at most one customer. A published `pm_card_*` id attaches a fresh copy.
    router.post('/v1/payment_methods/:id/attach', (req, res) => {
      const pm = resolvePaymentMethod(store, req.params.id, 'id');
      const p = parseParams(attachSchema, req.body);
      findCustomer(store, p.customer);
      if (pm.customer && pm.customer !== p.customer) {
        throw stateError('payment_method_unexpected_state', 'This PaymentMethod is already attached to another customer; detach it first.', {
          param: 'customer',
        });
      }
      const updated: PaymentMethod = { ...pm, customer: p.customer };
      table.set(pm.id, updated);
      if (!pm.customer) emitEvent(store, 'payment_method.attached', updated, causeOf(req, res));
      res.json(updated);
    });

    // https://docs.stripe.com/api/payment_methods/detach
    router.post('/v1/payment_methods/:id/detach', (req, res) => {
      const pm = find(req.params.id);
      parseParams(detachSchema, req.body);
      if (!pm.customer) {
        throw stateError('payment_method_unexpected_state', 'The payment method you provided is not attached to a customer.');
      }
      const updated: PaymentMethod = { ...pm, customer: null };
      table.set(pm.id, updated);
      emitEvent(store, 'payment_method.detached', updated, causeOf(req, res), { customer: pm.customer });
      res.json(updated);
    });

    return router;
  },
};
