import { Router } from 'express';
import { z } from 'zod';
import { resourceMissing } from './errors';
import { common, listPage, listParams, parseParams, type Metadata } from './params';
import type { PaymentMethod } from './payment-methods';
import type { PaymentResource } from './resource';
import type { PaymentStore } from './store';

/** Charge object (card payments only), https://docs.stripe.com/api/charges/object. */
export type Charge = {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  balance_transaction: null;
  billing_details: PaymentMethod['billing_details'];
  captured: boolean;
  created: number;
  currency: string;
  customer: string | null;
  description: string | null;
  disputed: false;
  failure_code: string | null;
  failure_message: string | null;
  livemode: false;
  metadata: Metadata;
  outcome: {
    network_status: 'approved_by_network' | 'declined_by_network';
    reason: string | null;
    risk_level: 'normal';
    seller_message: string;
    type: 'authorized' | 'issuer_declined';
  };
  paid: boolean;
  payment_intent: string;
  payment_method: string;
  payment_method_details: {
    type: 'card';
    card: {
      amount_authorized: number | null;
      brand: string;
      /** https://docs.stripe.com/api/charges/object#charge_object-payment_method_details-card-capture_before */
      capture_before?: number;
      checks: PaymentMethod['card']['checks'];
      country: string;
      exp_month: number;
      exp_year: number;
      fingerprint: string;
      funding: string;
      last4: string;
      network: string;
      network_transaction_id: string | null;
    };
  };
  refunded: boolean;
  status: 'succeeded' | 'failed';
};

export const chargeTable = (store: PaymentStore) => store.table<Charge>('charges');

export function findCharge(store: PaymentStore, id: string, param = 'id'): Charge {
  const charge = chargeTable(store).get(id);
  if (!charge) throw resourceMissing('charge', id, param);
  return charge;
}

export type ChargeAttempt = {
  intent: { id: string; amount: number; currency: string; customer: string | null; description: string | null; metadata: Metadata };
  pm: PaymentMethod;
  declineCode?: string;
  declineMessage?: string;
  /** Unix seconds after which an uncaptured authorization can no longer be captured. */
  captureBefore?: number;
  capture: boolean;
};

/** The charge one confirmation attempt creates: a failed charge for a decline,
 * otherwise an authorization (captured at once for automatic capture). */
export function createCharge(store: PaymentStore, a: ChargeAttempt): Charge {
  const declined = a.declineCode !== undefined;
  const charge: Charge = {
    id: store.newId('ch'),
    object: 'charge',
    amount: a.intent.amount,
    amount_captured: !declined && a.capture ? a.intent.amount : 0,
    amount_refunded: 0,
    balance_transaction: null,
    billing_details: a.pm.billing_details,
    captured: !declined && a.capture,
    created: store.nowSeconds(),
    currency: a.intent.currency,
    customer: a.intent.customer,
    description: a.intent.description,
    disputed: false,
    failure_code: declined ? 'card_declined' : null,
    failure_message: declined ? (a.declineMessage ?? 'Your card was declined.') : null,
    livemode: false,
    metadata: { ...a.intent.metadata },
    outcome: declined
      ? {
          network_status: 'declined_by_network',
          reason: a.declineCode!,
          risk_level: 'normal',
          seller_message: 'The bank did not return any further details with this decline.',
          type: 'issuer_declined',
        }
      : {
          network_status: 'approved_by_network',
          reason: null,
          risk_level: 'normal',
          seller_message: 'Payment complete.',
          type: 'authorized',
        },
    paid: !declined,
    payment_intent: a.intent.id,
    payment_method: a.pm.id,
    payment_method_details: {
      type: 'card',
      card: {
        amount_authorized: declined ? null : a.intent.amount,
        brand: a.pm.card.brand,
        ...(a.captureBefore !== undefined ? { capture_before: a.captureBefore } : {}),
        checks: a.pm.card.checks,
        country: a.pm.card.country,
        exp_month: a.pm.card.exp_month,
        exp_year: a.pm.card.exp_year,
        fingerprint: a.pm.card.fingerprint,
        funding: a.pm.card.funding,
        last4: a.pm.card.last4,
        network: a.pm.card.brand,
        network_transaction_id: declined ? null : `${Math.floor(store.clock() / 1000)}${a.pm.card.last4}`,
      },
    },
    refunded: false,
    status: declined ? 'failed' : 'succeeded',
  };
  chargeTable(store).set(charge.id, charge);
  return charge;
}

export function updateCharge(store: PaymentStore, id: string, patch: Partial<Charge>): Charge {
  const updated = { ...findCharge(store, id), ...patch };
  chargeTable(store).set(id, updated);
  return updated;
}

const retrieveSchema = z.strictObject(common);
const listSchema = z.strictObject({ ...common, ...listParams, payment_intent: z.string().optional(), customer: z.string().optional() });

/** Read-only: charges are made by confirming PaymentIntents. */
export const charges: PaymentResource = {
  name: 'charges',
  router(store) {
    const router = Router();

    // https://docs.stripe.com/api/charges/list
    router.get('/v1/charges', (req, res) => {
      const p = parseParams(listSchema, req.query);
      const all = [...chargeTable(store).values()].filter(
        (c) => (p.payment_intent === undefined || c.payment_intent === p.payment_intent) && (p.customer === undefined || c.customer === p.customer),
      );
      res.json(listPage('/v1/charges', all, p));
    });

    // https://docs.stripe.com/api/charges/retrieve
    router.get('/v1/charges/:id', (req, res) => {
      parseParams(retrieveSchema, req.query);
      res.json(findCharge(store, req.params.id));
    });

    return router;
  },
};
