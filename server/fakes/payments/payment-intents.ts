import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { chargeTable, createCharge, findCharge, updateCharge, type Charge } from './charges';
import { customerTable, findCustomer } from './customers';
import { ProviderError, invalidRequest, resourceMissing, stateError } from './errors';
import { causeOf, emitEvent, type EventCause } from './events';
import {
  applyMetadata,
  assertAcceptedAmount,
  common,
  currencyParam,
  formAmount,
  formBool,
  listPage,
  listParams,
  metadataParam,
  nullableText,
  parseParams,
  textOrNull,
  type Metadata,
} from './params';
import { cardOutcome, paymentMethodTable, resolvePaymentMethod, type PaymentMethod } from './payment-methods';
import type { PaymentResource } from './resource';
import type { PaymentStore } from './store';

/** Statuses, https://docs.stripe.com/payments/paymentintents/lifecycle. */
export type PaymentIntentStatus =
  'requires_payment_method' | 'requires_confirmation' | 'requires_action' | 'processing' | 'requires_capture' | 'canceled' | 'succeeded';

/** PaymentIntent object, https://docs.stripe.com/api/payment_intents/object. */
export type PaymentIntent = {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_capturable: number;
  amount_received: number;
  automatic_payment_methods: null;
  canceled_at: number | null;
  cancellation_reason: string | null;
  capture_method: 'automatic' | 'manual';
  client_secret: string;
  confirmation_method: 'automatic';
  created: number;
  currency: string;
  customer: string | null;
  description: string | null;
  last_payment_error: LastPaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Metadata;
  next_action: null;
  payment_method: string | null;
  payment_method_options: { card: { request_extended_authorization?: never } };
  payment_method_types: ['card'];
  receipt_email: string | null;
  setup_future_usage: 'off_session' | 'on_session' | null;
  statement_descriptor: string | null;
  status: PaymentIntentStatus;
};

type LastPaymentError = {
  type: 'card_error';
  code: 'card_declined';
  decline_code: string;
  message: string;
  charge: string;
  payment_method: PaymentMethod;
};

/** Internal bookkeeping the provider does not expose on the object. */
type IntentState = {
  /** Whether the confirmation that authorized it was merchant-initiated (off_session=true). */
  offSession: boolean;
  /** The authorization lapsed uncaptured (capture then fails with charge_expired_for_capture). */
  authorizationExpired: boolean;
};

const DAY = 24 * 60 * 60;

/**
 * How long an online card authorization can be captured, from
 * https://docs.stripe.com/payments/place-a-hold-on-a-payment-method ("Authorization
 * validity windows", card-not-present): customer-initiated — 7 days on every
 * brand; merchant-initiated — Visa 5 days, "the exact authorization window is
 * 4 days and 18 hours", other brands 7 days.
 */
export function authorizationWindowSeconds(brand: string, merchantInitiated: boolean): number {
  if (merchantInitiated && brand === 'visa') return 4 * DAY + 18 * 60 * 60;
  return 7 * DAY;
}

/** Card-error messages for the test declines (https://docs.stripe.com/declines/codes). */
const DECLINE_MESSAGES: Record<string, string> = {
  generic_decline: 'Your card was declined.',
  insufficient_funds: 'Your card has insufficient funds.',
};

export const intentTable = (store: PaymentStore) => store.table<PaymentIntent>('payment_intents');
const stateTable = (store: PaymentStore) => store.table<IntentState>('payment_intent_state');

function findIntent(store: PaymentStore, id: string, param = 'intent'): PaymentIntent {
  const intent = intentTable(store).get(id);
  if (!intent) throw resourceMissing('payment_intent', id, param);
  return intent;
}

function save(store: PaymentStore, intent: PaymentIntent): PaymentIntent {
  intentTable(store).set(intent.id, intent);
  return intent;
}

const captureBeforeOf = (store: PaymentStore, intent: PaymentIntent): number | undefined =>
  intent.latest_charge ? chargeTable(store).get(intent.latest_charge)?.payment_method_details.card.capture_before : undefined;

/**
 * Test-only (POST /__fake/authorizations/:id/age): moves an uncaptured
 * authorization's start back by `seconds`, so it lapses that much sooner — how
 * local set-ups re-create holds that were placed days ago.
 */
export function ageAuthorization(store: PaymentStore, id: string, seconds: number): PaymentIntent {
  const intent = findIntent(store, id, 'id');
  const charge = intent.latest_charge ? chargeTable(store).get(intent.latest_charge) : undefined;
  if (intent.status !== 'requires_capture' || !charge) return intent;
  const card = charge.payment_method_details.card;
  updateCharge(store, charge.id, {
    created: charge.created - seconds,
    payment_method_details: { ...charge.payment_method_details, card: { ...card, capture_before: (card.capture_before ?? store.nowSeconds()) - seconds } },
  });
  return save(store, { ...intent, created: intent.created - seconds });
}

/**
 * An uncaptured authorization past its `capture_before` is released and the
 * intent becomes `canceled` (https://docs.stripe.com/payments/place-a-hold-on-a-payment-method:
 * "If the authorization expires before you capture the funds, the funds are
 * released and the payment status changes to canceled"). Done lazily on every
 * access and by the sweep (clock advance, periodic timer).
 */
function expireIfDue(store: PaymentStore, intent: PaymentIntent, cause: EventCause = {}): PaymentIntent {
  if (intent.status !== 'requires_capture') return intent;
  const captureBefore = captureBeforeOf(store, intent);
  if (captureBefore === undefined || store.nowSeconds() < captureBefore) return intent;
  const state = stateTable(store).get(intent.id);
  if (state) state.authorizationExpired = true;
  // The provider marks a lapsed uncaptured charge refunded (https://docs.stripe.com/api/events/types#event_types-charge.expired).
  const charge = updateCharge(store, intent.latest_charge!, { refunded: true, amount_refunded: intent.amount });
  const canceled = save(store, {
    ...intent,
    status: 'canceled',
    amount_capturable: 0,
    canceled_at: captureBefore,
    cancellation_reason: 'automatic',
  });
  emitEvent(store, 'charge.expired', charge, cause);
  emitEvent(store, 'payment_intent.canceled', canceled, cause, { status: 'requires_capture' });
  return canceled;
}

export function expireAuthorizations(store: PaymentStore): void {
  for (const intent of [...intentTable(store).values()]) expireIfDue(store, intent);
}

/** `expand[]` on intents: latest_charge, payment_method, customer (https://docs.stripe.com/api/expanding_objects). */
export function renderIntent(store: PaymentStore, intent: PaymentIntent, expand: string[] | undefined): unknown {
  if (!expand?.length) return intent;
  const out: Record<string, unknown> = { ...intent };
  for (const path of expand) {
    if (path === 'latest_charge') out.latest_charge = intent.latest_charge ? findCharge(store, intent.latest_charge) : null;
    else if (path === 'payment_method') out.payment_method = intent.payment_method ? (paymentMethodTable(store).get(intent.payment_method) ?? null) : null;
    else if (path === 'customer') out.customer = intent.customer ? (customerTable(store).get(intent.customer) ?? null) : null;
    else throw invalidRequest(`This property cannot be expanded (${path}).`, { param: 'expand' });
  }
  return out;
}

const unexpectedState = (intent: PaymentIntent, action: string, allowed: PaymentIntentStatus[]) =>
  stateError(
    'payment_intent_unexpected_state',
    `This PaymentIntent's ${action} could not be performed because it has a status of ${intent.status}. ` +
      `Only a PaymentIntent with one of the following statuses may be ${action === 'capture' ? 'captured' : action === 'cancel' ? 'canceled' : 'confirmed'}: ${allowed.join(', ')}.`,
    { payment_intent: intent },
  );

export type ConfirmInput = { paymentMethod?: string; offSession?: boolean; forcedDecline?: string };

/**
 * One confirmation attempt (https://docs.stripe.com/api/payment_intents/confirm):
 * approve → `requires_capture` (manual) or `succeeded` (automatic); decline → a
 * failed charge, the intent back at `requires_payment_method` with
 * `last_payment_error`, and a 402 card error naming the intent.
 */
export function confirmIntent(store: PaymentStore, intent: PaymentIntent, input: ConfirmInput, cause: EventCause): PaymentIntent {
  const confirmable: PaymentIntentStatus[] = ['requires_payment_method', 'requires_confirmation', 'requires_action'];
  if (!confirmable.includes(intent.status)) throw unexpectedState(intent, 'confirm', confirmable);
  const pmId = input.paymentMethod ?? intent.payment_method;
  if (!pmId) {
    throw stateError(
      'payment_intent_unexpected_state',
      'You cannot confirm this PaymentIntent because it is missing a payment method. Update it with a payment_method, or pass one to confirm.',
      { param: 'payment_method', payment_intent: intent },
    );
  }
  const pm = resolvePaymentMethod(store, pmId);
  if (intent.customer && pm.customer && pm.customer !== intent.customer) {
    throw invalidRequest('The provided PaymentMethod belongs to another customer than this PaymentIntent.', {
      code: 'payment_intent_invalid_parameter',
      param: 'payment_method',
    });
  }

  const outcome = cardOutcome(store, pm.id);
  const declineCode = input.forcedDecline ?? (outcome.kind === 'decline' ? outcome.declineCode : undefined);
  const offSession = input.offSession ?? false;
  const manual = intent.capture_method === 'manual';

  if (declineCode) {
    const message = DECLINE_MESSAGES[declineCode] ?? 'Your card was declined.';
    const charge = createCharge(store, { intent, pm, declineCode, declineMessage: message, capture: false });
    const failed = save(store, {
      ...intent,
      status: 'requires_payment_method',
      payment_method: null,
      latest_charge: charge.id,
      last_payment_error: { type: 'card_error', code: 'card_declined', decline_code: declineCode, message, charge: charge.id, payment_method: pm },
    });
    emitEvent(store, 'charge.failed', charge, cause);
    emitEvent(store, 'payment_intent.payment_failed', failed, cause);
    // The provider's card error (https://docs.stripe.com/api/errors): HTTP 402,
    // type card_error, code card_declined, decline_code, plus the intent.
    throw new ProviderError(402, {
      type: 'card_error',
      code: 'card_declined',
      decline_code: declineCode,
      message,
      charge: charge.id,
      payment_intent: failed,
      payment_method: pm,
    });
  }

  const captureBefore = manual ? store.nowSeconds() + authorizationWindowSeconds(pm.card.brand, offSession) : undefined;
  const charge = createCharge(store, { intent, pm, captureBefore, capture: !manual });
  stateTable(store).set(intent.id, { offSession, authorizationExpired: false });
  const confirmed = save(store, {
    ...intent,
    status: manual ? 'requires_capture' : 'succeeded',
    payment_method: pm.id,
    latest_charge: charge.id,
    last_payment_error: null,
    amount_capturable: manual ? intent.amount : 0,
    amount_received: manual ? 0 : intent.amount,
  });
  emitEvent(store, 'charge.succeeded', charge, cause);
  if (manual) emitEvent(store, 'payment_intent.amount_capturable_updated', confirmed, cause, { amount_capturable: 0 });
  else emitEvent(store, 'payment_intent.succeeded', confirmed, cause, { status: intent.status, amount_received: 0 });
  return confirmed;
}

/** The parameters a new intent takes, from POST /v1/payment_intents or a Checkout Session's `payment_intent_data`. */
export type NewIntent = {
  amount: number;
  currency: string;
  customer: string | null;
  description: string | null;
  metadata: Metadata;
  captureMethod: 'automatic' | 'manual';
  paymentMethod: string | null;
  receiptEmail: string | null;
  statementDescriptor: string | null;
  setupFutureUsage: PaymentIntent['setup_future_usage'];
};

/** Stores a new, unconfirmed intent and emits `payment_intent.created`. */
export function openIntent(store: PaymentStore, n: NewIntent, cause: EventCause): PaymentIntent {
  const id = store.newId('pi');
  const intent = save(store, {
    id,
    object: 'payment_intent',
    amount: n.amount,
    amount_capturable: 0,
    amount_received: 0,
    automatic_payment_methods: null,
    canceled_at: null,
    cancellation_reason: null,
    capture_method: n.captureMethod,
    client_secret: `${id}_secret_${store.newId('x').slice(2)}`,
    confirmation_method: 'automatic',
    created: store.nowSeconds(),
    currency: n.currency,
    customer: n.customer,
    description: n.description,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    metadata: n.metadata,
    next_action: null,
    payment_method: n.paymentMethod,
    payment_method_options: { card: {} },
    payment_method_types: ['card'],
    receipt_email: n.receiptEmail,
    setup_future_usage: n.setupFutureUsage,
    statement_descriptor: n.statementDescriptor,
    status: n.paymentMethod ? 'requires_confirmation' : 'requires_payment_method',
  });
  emitEvent(store, 'payment_intent.created', intent, cause);
  return intent;
}

const createSchema = z.strictObject({
  ...common,
  amount: formAmount,
  currency: currencyParam,
  customer: z.string().optional(),
  description: nullableText,
  receipt_email: nullableText,
  statement_descriptor: z.string().max(22).optional(),
  payment_method: z.string().optional(),
  payment_method_types: z.array(z.literal('card')).optional(),
  capture_method: z.enum(['automatic', 'automatic_async', 'manual']).optional(),
  confirm: formBool.optional(),
  off_session: formBool.optional(),
  metadata: metadataParam,
});
const updateSchema = z.strictObject({
  ...common,
  amount: formAmount.optional(),
  currency: currencyParam.optional(),
  customer: z.string().optional(),
  description: nullableText,
  receipt_email: nullableText,
  payment_method: z.string().optional(),
  capture_method: z.enum(['automatic', 'automatic_async', 'manual']).optional(),
  metadata: metadataParam,
});
const confirmSchema = z.strictObject({
  ...common,
  payment_method: z.string().optional(),
  off_session: formBool.optional(),
  capture_method: z.enum(['automatic', 'automatic_async', 'manual']).optional(),
});
const captureSchema = z.strictObject({
  ...common,
  amount_to_capture: formAmount.optional(),
  metadata: metadataParam,
});
const cancelSchema = z.strictObject({
  ...common,
  cancellation_reason: z.enum(['duplicate', 'fraudulent', 'requested_by_customer', 'abandoned']).optional(),
});
const retrieveSchema = z.strictObject({ ...common, client_secret: z.string().optional() });
const listSchema = z.strictObject({ ...common, ...listParams, customer: z.string().optional() });

const forcedDecline = (res: Response): string | undefined => (typeof res.locals.forcedDecline === 'string' ? res.locals.forcedDecline : undefined);

export const paymentIntents: PaymentResource = {
  name: 'payment_intents',
  sweep: expireAuthorizations,
  router(store) {
    const router = Router();
    const table = intentTable(store);
    const load = (req: Request, res: Response) => expireIfDue(store, findIntent(store, String(req.params.id)), causeOf(req, res));

    // https://docs.stripe.com/api/payment_intents/create
    router.post('/v1/payment_intents', (req, res) => {
      const p = parseParams(createSchema, req.body);
      if (p.off_session !== undefined && !p.confirm) {
        // "This parameter can only be used with confirm=true." (create reference, off_session)
        throw invalidRequest('off_session can only be used when confirm=true.', { code: 'parameter_invalid', param: 'off_session' });
      }
      assertAcceptedAmount(p.amount, p.currency, 'amount');
      if (p.customer) findCustomer(store, p.customer);
      const cause = causeOf(req, res);
      const intent = openIntent(
        store,
        {
          amount: p.amount,
          currency: p.currency,
          customer: p.customer ?? null,
          description: textOrNull(p.description),
          metadata: applyMetadata({}, p.metadata),
          captureMethod: p.capture_method === 'manual' ? 'manual' : 'automatic',
          paymentMethod: p.payment_method ? resolvePaymentMethod(store, p.payment_method).id : null,
          receiptEmail: textOrNull(p.receipt_email),
          statementDescriptor: p.statement_descriptor ?? null,
          setupFutureUsage: null,
        },
        cause,
      );
      const result = p.confirm ? confirmIntent(store, intent, { offSession: p.off_session, forcedDecline: forcedDecline(res) }, cause) : intent;
      res.json(renderIntent(store, result, p.expand));
    });

    // https://docs.stripe.com/api/payment_intents/list
    router.get('/v1/payment_intents', (req, res) => {
      const p = parseParams(listSchema, req.query);
      const all = [...table.values()].filter((i) => p.customer === undefined || i.customer === p.customer).map((i) => expireIfDue(store, i));
      res.json(listPage('/v1/payment_intents', all, p));
    });

    // https://docs.stripe.com/api/payment_intents/retrieve
    router.get('/v1/payment_intents/:id', (req, res) => {
      const p = parseParams(retrieveSchema, req.query);
      res.json(renderIntent(store, load(req, res), p.expand));
    });

    // https://docs.stripe.com/api/payment_intents/update — only before confirmation succeeds.
    router.post('/v1/payment_intents/:id', (req, res) => {
      const intent = load(req, res);
      const p = parseParams(updateSchema, req.body);
      const editable: PaymentIntentStatus[] = ['requires_payment_method', 'requires_confirmation', 'requires_action'];
      const changesMoneyOrMethod = p.amount !== undefined || p.currency !== undefined || p.payment_method !== undefined || p.capture_method !== undefined;
      if (changesMoneyOrMethod && !editable.includes(intent.status)) throw unexpectedState(intent, 'update', editable);
      assertAcceptedAmount(p.amount ?? intent.amount, p.currency ?? intent.currency, 'amount');
      if (p.customer) findCustomer(store, p.customer);
      const pm = p.payment_method ? resolvePaymentMethod(store, p.payment_method) : undefined;
      const updated = save(store, {
        ...intent,
        amount: p.amount ?? intent.amount,
        currency: p.currency ?? intent.currency,
        customer: p.customer ?? intent.customer,
        description: textOrNull(p.description, intent.description),
        receipt_email: textOrNull(p.receipt_email, intent.receipt_email),
        capture_method: p.capture_method === undefined ? intent.capture_method : p.capture_method === 'manual' ? 'manual' : 'automatic',
        payment_method: pm?.id ?? intent.payment_method,
        status: pm && intent.status === 'requires_payment_method' ? 'requires_confirmation' : intent.status,
        metadata: applyMetadata(intent.metadata, p.metadata),
      });
      res.json(renderIntent(store, updated, p.expand));
    });

    // https://docs.stripe.com/api/payment_intents/confirm
    router.post('/v1/payment_intents/:id/confirm', (req, res) => {
      const intent = load(req, res);
      const p = parseParams(confirmSchema, req.body);
      const withCapture =
        p.capture_method === undefined ? intent : { ...intent, capture_method: p.capture_method === 'manual' ? ('manual' as const) : ('automatic' as const) };
      const confirmed = confirmIntent(
        store,
        withCapture,
        { paymentMethod: p.payment_method, offSession: p.off_session, forcedDecline: forcedDecline(res) },
        causeOf(req, res),
      );
      res.json(renderIntent(store, confirmed, p.expand));
    });

    // https://docs.stripe.com/api/payment_intents/capture — only from
    // requires_capture; amount_to_capture ≤ amount_capturable, the rest is
    // released (https://docs.stripe.com/payments/place-a-hold-on-a-payment-method#capture-funds).
    router.post('/v1/payment_intents/:id/capture', (req, res) => {
      const cause = causeOf(req, res);
      const p = parseParams(captureSchema, req.body);
      const intent = load(req, res);
      if (stateTable(store).get(intent.id)?.authorizationExpired) {
        // The expired-authorization error (https://docs.stripe.com/error-codes#charge-expired-for-capture).
        throw stateError(
          'charge_expired_for_capture',
          'This PaymentIntent could not be captured because its authorization has expired. Create a new PaymentIntent to charge the customer.',
          { payment_intent: intent, charge: intent.latest_charge ?? undefined },
        );
      }
      if (intent.status !== 'requires_capture') throw unexpectedState(intent, 'capture', ['requires_capture']);
      const amount = p.amount_to_capture ?? intent.amount_capturable;
      assertAcceptedAmount(amount, intent.currency, 'amount_to_capture');
      if (amount > intent.amount_capturable) {
        throw invalidRequest(`The amount to capture (${amount}) must be less than or equal to the amount capturable (${intent.amount_capturable}).`, {
          code: 'amount_too_large',
          param: 'amount_to_capture',
          payment_intent: intent,
        });
      }
      const charge: Charge = updateCharge(store, intent.latest_charge!, { captured: true, amount_captured: amount });
      const captured = save(store, {
        ...intent,
        status: 'succeeded',
        amount_received: amount,
        amount_capturable: 0,
        metadata: applyMetadata(intent.metadata, p.metadata),
      });
      emitEvent(store, 'charge.captured', charge, cause, { captured: false, amount_captured: 0 });
      emitEvent(store, 'payment_intent.succeeded', captured, cause, {
        status: 'requires_capture',
        amount_capturable: intent.amount_capturable,
        amount_received: 0,
      });
      res.json(renderIntent(store, captured, p.expand));
    });

    // https://docs.stripe.com/api/payment_intents/cancel — from
    // requires_payment_method, requires_capture, requires_confirmation,
    // requires_action or processing; an uncaptured authorization is released.
    router.post('/v1/payment_intents/:id/cancel', (req, res) => {
      const intent = load(req, res);
      const p = parseParams(cancelSchema, req.body);
      const cancelable: PaymentIntentStatus[] = ['requires_payment_method', 'requires_capture', 'requires_confirmation', 'requires_action', 'processing'];
      if (!cancelable.includes(intent.status)) throw unexpectedState(intent, 'cancel', cancelable);
      if (intent.status === 'requires_capture' && intent.latest_charge) {
        updateCharge(store, intent.latest_charge, { refunded: true, amount_refunded: intent.amount });
      }
      const canceled = save(store, {
        ...intent,
        status: 'canceled',
        amount_capturable: 0,
        canceled_at: store.nowSeconds(),
        cancellation_reason: p.cancellation_reason ?? null,
      });
      emitEvent(store, 'payment_intent.canceled', canceled, causeOf(req, res), { status: intent.status });
      res.json(renderIntent(store, canceled, p.expand));
    });

    return router;
  },
};

/** For refunds: the intent (expired if due) by id, 404 naming `param`. */
export function findIntentForRefund(store: PaymentStore, id: string, param: string): PaymentIntent {
  return expireIfDue(store, findIntent(store, id, param));
}
