import express, { Router } from 'express';
import type Stripe from 'stripe';
import { fromProviderAmount } from '../../shared/billing/provider-amounts';
import type { DataSource, EntityManager } from 'typeorm';
import { Scoped } from '../db/scoped';
import { documentedEndpoints } from '../http/endpoint';
import { AppError } from '../http/errors';
import { enqueueMail, staffAddresses } from '../notifications';
import { getRental } from '../rentals';
import { DepositAuthorization } from './deposit-authorization.entity';
import { PaymentEvent } from './payment-event.entity';
import type { PaymentGateway } from './payment-gateway';

/**
 * What an event means here. The provider's word is final about money: an
 * authorization we still count on that it cancelled on its own has lapsed;
 * one we did not see captured (our call timed out) was captured.
 */
async function apply(manager: EntityManager, event: Stripe.Event): Promise<{ organizationId: string | null; outcome: string }> {
  if (!event.type.startsWith('payment_intent.')) return { organizationId: null, outcome: 'not used' };
  const pi = event.data.object as Stripe.PaymentIntent;
  const found = await manager.findOne(DepositAuthorization, { where: { paymentIntentId: pi.id } });
  if (!found) return { organizationId: null, outcome: 'no deposit of ours' };
  const tx = new Scoped(manager, found.organizationId);
  // Locked: a clerk settling the same authorization right now finishes first or waits.
  await tx.sql(`SELECT id FROM deposit_authorizations WHERE organization_id = $1 AND id = $2 FOR UPDATE`, [found.id]);
  const authorization = await tx.get(DepositAuthorization, { id: found.id }, 'That card authorization');
  const rental = await getRental(tx, authorization.rentalId);
  if (event.type === 'payment_intent.canceled' && authorization.state === 'authorized') {
    Object.assign(authorization, { state: 'lapsed', settledAt: new Date() });
    await tx.save(DepositAuthorization, authorization);
    await enqueueMail(tx, await staffAddresses(tx, ['billing', 'owner']), {
      subject: `Deposit authorization lapsed: rental ${rental.number}`,
      heading: `The card authorization for rental ${rental.number} has lapsed`,
      paragraphs: [
        `The provider released the authorization (${pi.cancellation_reason ?? 'no reason given'}). Nothing is secured on the card any more.`,
        'Charges at return can still go on the saved card, or on the invoice.',
      ],
    });
    return { organizationId: authorization.organizationId, outcome: `authorization ${authorization.id} lapsed` };
  }
  if (event.type === 'payment_intent.succeeded' && authorization.kind === 'authorization' && authorization.state === 'authorized') {
    Object.assign(authorization, { state: 'captured', capturedMinor: fromProviderAmount(pi.amount_received, pi.currency), captureReason: 'captured at the provider; its reply to us was lost', settledAt: new Date() });
    await tx.save(DepositAuthorization, authorization);
    return { organizationId: authorization.organizationId, outcome: `authorization ${authorization.id} captured (${pi.amount_received})` };
  }
  return { organizationId: authorization.organizationId, outcome: 'already up to date' };
}

/**
 * POST /api/webhooks/payments: the raw body is verified with the SDK's own
 * signature check; each event id is recorded in the transaction that applies
 * it, so a re-delivery is answered 200 and changes nothing.
 */
export function paymentWebhookRoutes(db: DataSource, gateway: PaymentGateway, secret: string): Router {
  const router = Router();
  documentedEndpoints.push({ method: 'post', path: '/api/webhooks/payments', summary: 'Payment provider events (signed; verified with the SDK)', access: 'public' });
  router.post('/api/webhooks/payments', express.raw({ type: () => true, limit: '1mb' }), async (req, res, next) => {
    try {
      let event: Stripe.Event;
      try {
        event = gateway.verifyEvent(req.body as Buffer, String(req.get('stripe-signature') ?? ''), secret);
      } catch (err) {
        throw new AppError(400, 'invalid_signature', `The webhook signature does not verify: ${(err as Error).message}`);
      }
      const result = await db.transaction(async (manager) => {
        const inserted = await manager.query(`INSERT INTO payment_events (event_id, type, outcome) VALUES ($1, $2, 'received') ON CONFLICT (event_id) DO NOTHING RETURNING event_id`, [event.id, event.type]);
        if (!inserted.length) return { duplicate: true };
        const { organizationId, outcome } = await apply(manager, event);
        await manager.update(PaymentEvent, { eventId: event.id }, { organizationId, outcome });
        return { duplicate: false, outcome };
      });
      res.json({ received: true, ...result });
    } catch (err) {
      next(err);
    }
  });
  return router;
}
