import express, { Router } from 'express';
import type Stripe from 'stripe';
import { fromProviderAmount } from '../../shared/billing/provider-amounts';
import type { DataSource, EntityManager } from 'typeorm';
import { Scoped } from '../db/scoped';
import { documentedEndpoints } from '../http/endpoint';
import { AppError } from '../http/errors';
import { enqueueMail, staffAddresses } from '../notifications';
import { authorizationLapsedMail } from './billing-mail';
import { getRental } from '../rentals';
import { DepositAuthorization } from './deposit-authorization.entity';
import { applyRequestEvent, requestOf } from './deposit-request-events';
import { PaymentEvent } from './payment-event.entity';
import type { PaymentGateway } from './payment-gateway';

/** Events that would change a card authorization's state here, and the intent status each claims; the provider confirms it before it counts. */
const CLAIMS: Partial<Record<string, Stripe.PaymentIntent.Status>> = { 'payment_intent.canceled': 'canceled', 'payment_intent.succeeded': 'succeeded' };

/**
 * The PaymentIntent as the provider holds it now, fetched for an event that
 * would change one of our holds: a valid signature proves only who signed,
 * so a leaked secret or a replayed event cannot lapse or capture an authorization the
 * provider still holds. Fetched before the transaction (no row locks held
 * over the network); an outage answers 502 and the provider delivers again.
 */
async function providerView(db: DataSource, gateway: PaymentGateway, event: Stripe.Event): Promise<Stripe.PaymentIntent | null> {
  if (!CLAIMS[event.type]) return null;
  const id = (event.data.object as Stripe.PaymentIntent).id;
  if (typeof id !== 'string' || !(await db.getRepository(DepositAuthorization).exists({ where: { paymentIntentId: id } }))) return null;
  return gateway.retrieve(id);
}

/**
 * What an event means here. The provider's word is final about money: an
 * authorization we still count on that it cancelled on its own has lapsed;
 * one we did not see captured (our call timed out) was captured. Its word is
 * what it answers when asked (`current`), not what the event body claims.
 */
async function apply(
  manager: EntityManager,
  event: Stripe.Event,
  current: Stripe.PaymentIntent | null,
): Promise<{ organizationId: string | null; outcome: string }> {
  if (!event.type.startsWith('payment_intent.')) return { organizationId: null, outcome: 'not used' };
  const pi = event.data.object as Stripe.PaymentIntent;
  const found = await manager.findOne(DepositAuthorization, { where: { paymentIntentId: pi.id } });
  if (!found) return { organizationId: null, outcome: 'no deposit of ours' };
  const tx = new Scoped(manager, found.organizationId);
  // Locked: a clerk settling the same authorization right now finishes first or waits.
  await tx.sql(`SELECT id FROM deposit_authorizations WHERE organization_id = $1 AND id = $2 FOR UPDATE`, [found.id]);
  const authorization = await tx.get(DepositAuthorization, { id: found.id }, 'That card authorization');
  const rental = await getRental(tx, authorization.rentalId);
  const claim = CLAIMS[event.type];
  if (!claim || authorization.state !== 'authorized') return { organizationId: authorization.organizationId, outcome: 'already up to date' };
  if (current?.status !== claim) {
    return {
      organizationId: authorization.organizationId,
      outcome: `not confirmed: the provider says ${pi.id} is ${current?.status ?? 'unknown'}, not ${claim}; nothing changed`,
    };
  }
  if (claim === 'canceled') {
    Object.assign(authorization, { state: 'lapsed', settledAt: new Date() });
    await tx.save(DepositAuthorization, authorization);
    await enqueueMail(tx, await staffAddresses(tx, ['billing', 'owner']), authorizationLapsedMail, { rental, reason: current.cancellation_reason ?? null });
    return { organizationId: authorization.organizationId, outcome: `authorization ${authorization.id} lapsed` };
  }
  if (authorization.kind === 'authorization') {
    Object.assign(authorization, {
      state: 'captured',
      capturedMinor: fromProviderAmount(current.amount_received, current.currency),
      captureReason: 'captured at the provider; its reply to us was lost',
      settledAt: new Date(),
    });
    await tx.save(DepositAuthorization, authorization);
    return { organizationId: authorization.organizationId, outcome: `authorization ${authorization.id} captured (${current.amount_received})` };
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
  documentedEndpoints.push({
    method: 'post',
    path: '/api/webhooks/payments',
    summary: 'Payment provider events (signed; verified with the SDK)',
    access: 'public',
  });
  router.post('/api/webhooks/payments', express.raw({ type: () => true, limit: '1mb' }), async (req, res, next) => {
    try {
      let event: Stripe.Event;
      try {
        event = gateway.verifyEvent(req.body as Buffer, String(req.get('stripe-signature') ?? ''), secret);
      } catch (err) {
        throw new AppError(400, 'invalid_signature', `The webhook signature does not verify: ${(err as Error).message}`);
      }
      const request = await requestOf(db.manager, event);
      // Fetched before the transaction, as below: the page's session with its intent, as the provider holds them now.
      const session = request ? await gateway.retrieveCheckout(request.checkoutSessionId) : null;
      const current = request ? null : await providerView(db, gateway, event);
      const result = await db.transaction(async (manager) => {
        const inserted = await manager.query(
          `INSERT INTO payment_events (event_id, type, outcome) VALUES ($1, $2, 'received') ON CONFLICT (event_id) DO NOTHING RETURNING event_id`,
          [event.id, event.type],
        );
        if (!inserted.length) return { duplicate: true };
        const { organizationId, outcome } =
          request && session ? await applyRequestEvent(manager, gateway, event, request, session) : await apply(manager, event, current);
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
