import type Stripe from 'stripe';
import type { EntityManager } from 'typeorm';
import { recordAudit } from '../audit/audit.service';
import { Scoped } from '../db/scoped';
import { lockRental, rememberRentalCard } from '../rentals';
import { DepositAuthorization } from './deposit-authorization.entity';
import { DepositRequest } from './deposit-request.entity';
import { depositState } from './deposit-state';
import type { PaymentGateway } from './payment-gateway';

/** The provider's events about a renter's hosted page and the intent made on it. */
const REQUEST_EVENTS = new Set([
  'checkout.session.completed',
  'checkout.session.expired',
  'payment_intent.amount_capturable_updated',
  'payment_intent.payment_failed',
]);

/** Our request an event speaks of: a session by its id, an intent by the request's key in its metadata (set when the page was made). */
export async function requestOf(manager: EntityManager, event: Stripe.Event): Promise<DepositRequest | null> {
  if (!REQUEST_EVENTS.has(event.type)) return null;
  const object = event.data.object as { id?: unknown; metadata?: Record<string, string> | null };
  if (event.type.startsWith('checkout.session.'))
    return typeof object.id === 'string' ? manager.findOne(DepositRequest, { where: { checkoutSessionId: object.id } }) : null;
  const key = object.metadata?.depositRequest;
  return key ? manager.findOne(DepositRequest, { where: { idempotencyKey: key } }) : null;
}

type Applied = { organizationId: string; outcome: string };

/**
 * What an event about a renter's page means here, decided by the session as
 * the provider answers for it now (`session`, fetched with its intent), not
 * by the event body: a signature proves only who signed. Any of the events
 * may come first, twice, or before the renter is back; each finds the
 * record as the first one left it.
 */
export async function applyRequestEvent(
  manager: EntityManager,
  gateway: PaymentGateway,
  event: Stripe.Event,
  found: DepositRequest,
  session: Stripe.Checkout.Session,
): Promise<Applied> {
  const tx = new Scoped(manager, found.organizationId);
  await lockRental(tx, found.rentalId);
  const request = await tx.get(DepositRequest, { id: found.id }, 'That deposit request');
  const done = (outcome: string): Applied => ({ organizationId: request.organizationId, outcome });
  const intent = session.payment_intent && typeof session.payment_intent === 'object' ? session.payment_intent : null;

  if (session.status === 'complete' && intent?.status === 'requires_capture') return done(await recordAuthorization(tx, gateway, request, intent, session.id));
  if (session.status === 'expired') {
    if (request.state !== 'open') return done('already up to date');
    await tx.updateWhere(DepositRequest, { id: request.id }, { state: 'expired' });
    await recordAudit(tx, null, 'deposit.request_expired', { type: 'rental', id: request.rentalId }, { checkoutSessionId: session.id });
    return done(`request ${request.id} expired`);
  }
  const declined = intent?.status === 'requires_payment_method' ? intent.last_payment_error : null;
  if (event.type === 'payment_intent.payment_failed' && declined && request.state === 'open') {
    const message = declined.message ?? 'The card was declined.';
    await tx.updateWhere(DepositRequest, { id: request.id }, { declineMessage: message });
    await recordAudit(tx, null, 'deposit.declined', { type: 'rental', id: request.rentalId }, { via: 'hosted page', checkoutSessionId: session.id, message });
    return done(`request ${request.id}: card declined (${declined.decline_code ?? declined.code ?? 'no code'})`);
  }
  return done(`not confirmed: the provider says session ${session.id} is ${session.status}, its intent ${intent?.status ?? 'not made yet'}; nothing changed`);
}

async function recordAuthorization(tx: Scoped, gateway: PaymentGateway, request: DepositRequest, intent: Stripe.PaymentIntent, sessionId: string) {
  if (await tx.count(DepositAuthorization, { paymentIntentId: intent.id })) {
    if (request.state === 'open') await tx.updateWhere(DepositRequest, { id: request.id }, { state: 'complete', declineMessage: null });
    return 'already up to date';
  }
  const rows = await tx.find(DepositAuthorization, { where: { rentalId: request.rentalId } });
  if (depositState(rows).state === 'authorized') {
    // Authorized meanwhile another way (the counter): a second authorization would hold the renter's money twice.
    await gateway.cancel(intent.id, `${request.idempotencyKey}:surplus`);
    await tx.updateWhere(DepositRequest, { id: request.id }, { state: 'replaced' });
    return `intent ${intent.id} released: the deposit was already authorized`;
  }
  const o = gateway.describeIntent(intent);
  if (!o.ok) return 'not an authorization';
  await tx.insert(DepositAuthorization, {
    rentalId: request.rentalId,
    kind: 'authorization',
    paymentIntentId: intent.id,
    idempotencyKey: request.idempotencyKey,
    state: 'authorized',
    amountMinor: o.amountMinor,
    capturedMinor: 0,
    cardBrand: o.cardBrand,
    cardLast4: o.cardLast4,
    captureBefore: o.captureBefore,
    initiatedBy: 'customer',
    failureMessage: null,
    captureReason: null,
    settledAt: null,
  });
  const card = typeof intent.payment_method === 'string' ? intent.payment_method : intent.payment_method?.id;
  if (card) await rememberRentalCard(tx, request.rentalId, card);
  await tx.updateWhere(DepositRequest, { id: request.id }, { state: 'complete', declineMessage: null });
  await recordAudit(
    tx,
    null,
    'deposit.authorized',
    { type: 'rental', id: request.rentalId },
    { via: 'hosted page', checkoutSessionId: sessionId, amountMinor: o.amountMinor, card: o.cardLast4 },
  );
  return `authorization recorded for intent ${intent.id}`;
}
