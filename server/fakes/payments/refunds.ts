import { Router } from 'express';
import { z } from 'zod';
import { findCharge, updateCharge, type Charge } from './charges';
import { invalidRequest, resourceMissing, stateError } from './errors';
import { causeOf, emitEvent } from './events';
import { applyMetadata, assertAcceptedAmount, common, formAmount, listPage, listParams, metadataParam, parseParams, type Metadata } from './params';
import { findIntentForRefund } from './payment-intents';
import type { PaymentResource } from './resource';
import type { PaymentStore } from './store';

/** Refund object, https://docs.stripe.com/api/refunds/object. */
export type Refund = {
  id: string;
  object: 'refund';
  amount: number;
  balance_transaction: null;
  charge: string;
  created: number;
  currency: string;
  destination_details: { type: 'card'; card: { type: 'refund'; reference_status: 'pending' } };
  metadata: Metadata;
  payment_intent: string;
  reason: 'duplicate' | 'fraudulent' | 'requested_by_customer' | null;
  status: 'succeeded';
};

export const refundTable = (store: PaymentStore) => store.table<Refund>('refunds');

const createSchema = z.strictObject({
  ...common,
  payment_intent: z.string().optional(),
  charge: z.string().optional(),
  amount: formAmount.optional(),
  reason: z.enum(['duplicate', 'fraudulent', 'requested_by_customer']).optional(),
  metadata: metadataParam,
});
const retrieveSchema = z.strictObject(common);
const listSchema = z.strictObject({ ...common, ...listParams, payment_intent: z.string().optional(), charge: z.string().optional() });

export const refunds: PaymentResource = {
  name: 'refunds',
  router(store) {
    const router = Router();
    const table = refundTable(store);

    // https://docs.stripe.com/api/refunds/create — refunds a captured payment,
    // in full by default; `amount` at most what was captured minus what was
    // already refunded (https://docs.stripe.com/refunds#issuing).
    router.post('/v1/refunds', (req, res) => {
      const p = parseParams(createSchema, req.body);
      if (!p.payment_intent && !p.charge) {
        throw invalidRequest('One of the following params should be provided for this request: payment_intent or charge.', {
          code: 'parameter_missing',
          param: 'payment_intent',
        });
      }
      let charge: Charge;
      if (p.payment_intent) {
        const intent = findIntentForRefund(store, p.payment_intent, 'payment_intent');
        if (intent.status !== 'succeeded' || !intent.latest_charge) {
          throw stateError(
            'charge_not_refundable',
            `This PaymentIntent (${intent.id}) does not have a successful charge to refund; its status is ${intent.status}.`,
            { param: 'payment_intent' },
          );
        }
        charge = findCharge(store, intent.latest_charge, 'payment_intent');
        if (p.charge && p.charge !== charge.id) {
          throw invalidRequest('The charge given does not belong to the payment_intent given.', { param: 'charge' });
        }
      } else {
        charge = findCharge(store, p.charge!, 'charge');
      }
      if (!charge.captured) {
        throw stateError('charge_not_refundable', `Charge ${charge.id} has not been captured; cancel its PaymentIntent instead.`, {
          param: p.payment_intent ? 'payment_intent' : 'charge',
        });
      }
      const refundable = charge.amount_captured - charge.amount_refunded;
      if (refundable <= 0) {
        throw stateError('charge_already_refunded', `Charge ${charge.id} has already been refunded.`, { charge: charge.id });
      }
      const amount = p.amount ?? refundable;
      assertAcceptedAmount(amount, charge.currency, 'amount');
      if (amount > refundable) {
        throw invalidRequest(`Refund amount (${amount}) is greater than the unrefunded amount on charge ${charge.id} (${refundable}).`, {
          code: 'amount_too_large',
          param: 'amount',
        });
      }
      const refund: Refund = {
        id: store.newId('re'),
        object: 'refund',
        amount,
        balance_transaction: null,
        charge: charge.id,
        created: store.nowSeconds(),
        currency: charge.currency,
        destination_details: { type: 'card', card: { type: 'refund', reference_status: 'pending' } },
        metadata: applyMetadata({}, p.metadata),
        payment_intent: charge.payment_intent,
        reason: p.reason ?? null,
        status: 'succeeded',
      };
      table.set(refund.id, refund);
      const amountRefunded = charge.amount_refunded + amount;
      const updated = updateCharge(store, charge.id, {
        amount_refunded: amountRefunded,
        refunded: amountRefunded >= charge.amount_captured,
      });
      const cause = causeOf(req, res);
      emitEvent(store, 'refund.created', refund, cause);
      emitEvent(store, 'charge.refunded', updated, cause, { amount_refunded: charge.amount_refunded, refunded: charge.refunded });
      res.json(refund);
    });

    // https://docs.stripe.com/api/refunds/list
    router.get('/v1/refunds', (req, res) => {
      const p = parseParams(listSchema, req.query);
      const all = [...table.values()].filter(
        (r) => (p.payment_intent === undefined || r.payment_intent === p.payment_intent) && (p.charge === undefined || r.charge === p.charge),
      );
      res.json(listPage('/v1/refunds', all, p));
    });

    // https://docs.stripe.com/api/refunds/retrieve
    router.get('/v1/refunds/:id', (req, res) => {
      parseParams(retrieveSchema, req.query);
      const refund = table.get(req.params.id);
      if (!refund) throw resourceMissing('refund', req.params.id, 'id');
      res.json(refund);
    });

    return router;
  },
};
