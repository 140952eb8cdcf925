import express, { Router, type Request } from 'express';
import { z } from 'zod';
import { invalidRequest, ProviderError, resourceMissing, stateError } from './errors';
import { causeOf, emitEvent } from './events';
import { applyMetadata, assertAcceptedAmount, common, currencyParam, formAmount, formInt, metadataParam, parseParams, type Metadata } from './params';
import { confirmIntent, intentTable, openIntent, renderIntent, type PaymentIntent } from './payment-intents';
import { createFromToken, paymentMethodTable, TEST_CARD_NUMBERS } from './payment-methods';
import type { PaymentResource } from './resource';
import type { PaymentStore } from './store';

/** Checkout Session object, the fields this fake keeps (https://docs.stripe.com/api/checkout/sessions/object). */
export type CheckoutSession = {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: string | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Metadata;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: ['card'];
  /** With manual capture nothing is paid yet when the card is authorized: `unpaid` (from memory of the provider's docs). */
  payment_status: 'paid' | 'unpaid';
  status: 'open' | 'complete' | 'expired';
  success_url: string;
  url: string | null;
  /** What the PaymentIntent made on the hosted page starts with (kept here, not part of the provider's object). */
  line_item_name: string;
};

type IntentData = {
  capture_method: 'automatic' | 'manual';
  setup_future_usage: 'off_session' | 'on_session' | null;
  description: string | null;
  metadata: Metadata;
};

export const sessionTable = (store: PaymentStore) => store.table<CheckoutSession>('checkout_sessions');
const intentDataTable = (store: PaymentStore) => store.table<IntentData>('checkout_session_intent_data');

const HOUR = 3600;

const createSchema = z.strictObject({
  ...common,
  mode: z.literal('payment'),
  customer: z.string().optional(),
  customer_email: z.string().optional(),
  client_reference_id: z.string().max(200).optional(),
  success_url: z.string().url(),
  cancel_url: z.string().url().optional(),
  expires_at: formInt.optional(),
  metadata: metadataParam,
  payment_method_types: z.array(z.literal('card')).optional(),
  line_items: z
    .array(
      z.strictObject({
        quantity: formInt.pipe(z.number().int().min(1).max(1)),
        price_data: z.strictObject({
          currency: currencyParam,
          unit_amount: formAmount,
          product_data: z.strictObject({ name: z.string().min(1).max(250), description: z.string().max(500).optional() }),
        }),
      }),
    )
    .length(1),
  payment_intent_data: z
    .strictObject({
      capture_method: z.enum(['automatic', 'automatic_async', 'manual']).optional(),
      setup_future_usage: z.enum(['off_session', 'on_session']).optional(),
      description: z.string().max(1000).optional(),
      metadata: metadataParam,
    })
    .optional(),
});
const retrieveSchema = z.strictObject(common);

function findSession(store: PaymentStore, id: string): CheckoutSession {
  const session = sessionTable(store).get(id);
  if (!session) throw resourceMissing('checkout.session', id, 'session');
  return session;
}

const save = (store: PaymentStore, session: CheckoutSession) => {
  sessionTable(store).set(session.id, session);
  return session;
};

/** An open session past `expires_at` expires (https://docs.stripe.com/api/checkout/sessions/expire: "checkout.session.expired"). */
function expire(store: PaymentStore, session: CheckoutSession, cause = {}): CheckoutSession {
  const expired = save(store, { ...session, status: 'expired', url: null });
  emitEvent(store, 'checkout.session.expired', publicView(expired), cause, { status: 'open' });
  return expired;
}

const expireIfDue = (store: PaymentStore, session: CheckoutSession) =>
  session.status === 'open' && store.nowSeconds() >= session.expires_at ? expire(store, session) : session;

/** The object as the provider shows it (the kept intent data stays inside the fake). */
const publicView = ({ line_item_name: _, ...session }: CheckoutSession) => session;

/** `expand[]`: payment_intent and payment_intent.latest_charge (https://docs.stripe.com/api/expanding_objects). */
function render(store: PaymentStore, session: CheckoutSession, expand: string[] | undefined): unknown {
  const out: Record<string, unknown> = publicView(session);
  if (!expand?.length) return out;
  for (const path of expand) {
    if (path !== 'payment_intent' && path !== 'payment_intent.latest_charge')
      throw invalidRequest(`This property cannot be expanded (${path}).`, { param: 'expand' });
  }
  const intent = session.payment_intent ? intentTable(store).get(session.payment_intent) : undefined;
  out.payment_intent = intent ? renderIntent(store, intent, expand.includes('payment_intent.latest_charge') ? ['latest_charge'] : undefined) : null;
  return out;
}

/** The amount for the page only, in the currency's usual digits (the fake stays apart from Nestkeeper's own money code). */
function displayAmount(amount: number, currency: string): string {
  const format = new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() });
  return format.format(amount / 10 ** (format.resolvedOptions().maximumFractionDigits ?? 2));
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The hosted payment page: a plain form, the card typed here and never sent to the merchant. */
function hostedPage(session: CheckoutSession, problem?: string, typed: { number?: string; expiry?: string } = {}): string {
  const amount = displayAmount(session.amount_total, session.currency);
  const body =
    session.status === 'open'
      ? `<p>${escapeHtml(session.line_item_name)}</p>
<p class="amount">${escapeHtml(amount)}</p>
<p class="small">Test mode: this local stand-in for the payment provider accepts the provider's published test card numbers only.</p>
${problem ? `<p class="problem" role="alert">${escapeHtml(problem)}</p>` : ''}
<form method="post" novalidate>
<label for="card-number">Card number</label>
<input id="card-number" name="cardNumber" inputmode="numeric" autocomplete="cc-number" value="${escapeHtml(typed.number ?? '')}" required>
<div class="row"><div><label for="card-expiry">Expiry</label>
<input id="card-expiry" name="expiry" placeholder="MM / YY" autocomplete="cc-exp" value="${escapeHtml(typed.expiry ?? '')}" required></div>
<div><label for="card-cvc">CVC</label>
<input id="card-cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" required></div></div>
<button type="submit">Authorize ${escapeHtml(amount)}</button>
</form>
${session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url.replace('{CHECKOUT_SESSION_ID}', session.id))}">Back without paying</a></p>` : ''}`
      : `<p role="alert">${session.status === 'complete' ? 'This payment is complete.' : 'This payment page has expired. Ask the merchant for a new link.'}</p>`;
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Payment — test mode</title>
<style>body{font:16px system-ui,sans-serif;margin:0;background:#f4f4f4;color:#222}main{max-width:26rem;margin:0 auto;padding:1rem;background:#fff;min-height:100vh}
label{display:block;font-weight:600;margin:.75rem 0 .25rem}input{width:100%;box-sizing:border-box;font-size:1rem;padding:.6rem;border:1px solid #888;border-radius:4px}
.row{display:flex;gap:.75rem}.row>div{flex:1}button{margin-top:1rem;width:100%;padding:.75rem;font-size:1rem;font-weight:600;border:0;border-radius:4px;background:#2d3a8c;color:#fff}
.amount{font-size:1.5rem;font-weight:700}.small{font-size:.85rem;color:#555}.problem{color:#9b1c1c;font-weight:600;border-left:4px solid #9b1c1c;padding-left:.5rem}
:focus-visible{outline:3px solid #e0a100;outline-offset:2px}</style></head>
<body><main><h1>Pay by card</h1>${body}</main></body></html>`;
}

const cardForm = z.object({ cardNumber: z.string().default(''), expiry: z.string().default(''), cvc: z.string().default('') });

/** What is wrong with the typed card, in the words a payment page uses; null when it may be tried. */
function cardProblem(store: PaymentStore, form: z.infer<typeof cardForm>): string | null {
  const digits = form.cardNumber.replace(/[\s-]/g, '');
  if (!/^\d{12,19}$/.test(digits)) return 'Your card number is incomplete.';
  if (!TEST_CARD_NUMBERS[digits]) return 'Your card was declined. This is test mode: use one of the provider’s published test card numbers.';
  const expiry = /^\s*(\d{1,2})\s*\/?\s*(\d{2})\s*$/.exec(form.expiry);
  if (!expiry || Number(expiry[1]) < 1 || Number(expiry[1]) > 12) return 'Your card’s expiry date is incomplete.';
  const now = new Date(store.clock());
  const [year, month] = [2000 + Number(expiry[2]), Number(expiry[1])];
  if (year < now.getUTCFullYear() || (year === now.getUTCFullYear() && month < now.getUTCMonth() + 1)) return 'Your card’s expiry date is in the past.';
  if (!/^\d{3,4}$/.test(form.cvc.trim())) return 'Your card’s security code is incomplete.';
  return null;
}

/**
 * The typed card authorizes the session's intent (made on the first attempt,
 * reused after a decline as the provider does). Success completes the session
 * and emits `checkout.session.completed` after the intent's own events.
 */
function pay(store: PaymentStore, session: CheckoutSession, digits: string): { ok: true; session: CheckoutSession } | { ok: false; message: string } {
  const data = intentDataTable(store).get(session.id)!;
  let intent: PaymentIntent | undefined = session.payment_intent ? intentTable(store).get(session.payment_intent) : undefined;
  if (!intent) {
    intent = openIntent(
      store,
      {
        amount: session.amount_total,
        currency: session.currency,
        customer: session.customer,
        description: data.description,
        metadata: data.metadata,
        captureMethod: data.capture_method,
        paymentMethod: null,
        receiptEmail: session.customer_email,
        statementDescriptor: null,
        setupFutureUsage: data.setup_future_usage,
      },
      {},
    );
    session = save(store, { ...session, payment_intent: intent.id });
  }
  const pm = createFromToken(store, TEST_CARD_NUMBERS[digits]!, undefined, {});
  try {
    confirmIntent(store, intent, { paymentMethod: pm.id, offSession: false }, {});
  } catch (err) {
    if (err instanceof ProviderError && err.body.type === 'card_error') return { ok: false, message: err.body.message };
    throw err;
  }
  // Saved for later off-session use: the card is attached to the customer (https://docs.stripe.com/payments/save-during-payment).
  if (data.setup_future_usage && session.customer) {
    const attached = { ...pm, customer: session.customer };
    paymentMethodTable(store).set(pm.id, attached);
    emitEvent(store, 'payment_method.attached', attached, {});
  }
  const complete = save(store, { ...session, status: 'complete', payment_status: data.capture_method === 'manual' ? 'unpaid' : 'paid' });
  emitEvent(store, 'checkout.session.completed', publicView(complete), {}, { status: 'open' });
  return { ok: true, session: complete };
}

const hostedUrl = (req: Request, id: string) => `${req.protocol}://${req.get('host')}/pay/${id}`;

export const checkoutSessions: PaymentResource = {
  name: 'checkout_sessions',
  sweep(store) {
    for (const session of [...sessionTable(store).values()]) expireIfDue(store, session);
  },
  router(store) {
    const router = Router();

    // https://docs.stripe.com/api/checkout/sessions/create — one line item, card only.
    router.post('/v1/checkout/sessions', (req, res) => {
      const p = parseParams(createSchema, req.body);
      const now = store.nowSeconds();
      // "It can be anywhere from 30 minutes to 24 hours after Checkout Session creation. By default, this value is 24 hours from creation." (create reference, expires_at)
      const expiresAt = p.expires_at ?? now + 24 * HOUR;
      if (expiresAt < now + HOUR / 2 || expiresAt > now + 24 * HOUR)
        throw invalidRequest('The expires_at timestamp must be between 30 minutes and 24 hours from Checkout Session creation.', { param: 'expires_at' });
      if (p.customer && p.customer_email)
        throw invalidRequest('You may only specify one of these parameters: customer, customer_email.', { param: 'customer' });
      const item = p.line_items[0]!;
      assertAcceptedAmount(item.price_data.unit_amount, item.price_data.currency, 'line_items[0][price_data][unit_amount]');
      const id = `cs_test_${store.newId('x').slice(2)}`;
      const intentData = p.payment_intent_data;
      intentDataTable(store).set(id, {
        capture_method: intentData?.capture_method === 'manual' ? 'manual' : 'automatic',
        setup_future_usage: intentData?.setup_future_usage ?? null,
        description: intentData?.description ?? null,
        metadata: applyMetadata({}, intentData?.metadata),
      });
      const session = save(store, {
        id,
        object: 'checkout.session',
        amount_subtotal: item.price_data.unit_amount,
        amount_total: item.price_data.unit_amount,
        cancel_url: p.cancel_url ?? null,
        client_reference_id: p.client_reference_id ?? null,
        created: now,
        currency: item.price_data.currency,
        customer: p.customer ?? null,
        customer_email: p.customer_email ?? null,
        expires_at: expiresAt,
        livemode: false,
        metadata: applyMetadata({}, p.metadata),
        mode: 'payment',
        payment_intent: null,
        payment_method_types: ['card'],
        payment_status: 'unpaid',
        status: 'open',
        success_url: p.success_url,
        url: hostedUrl(req, id),
        line_item_name: item.price_data.product_data.name,
      });
      res.json(render(store, session, p.expand));
    });

    // https://docs.stripe.com/api/checkout/sessions/retrieve
    router.get('/v1/checkout/sessions/:id', (req, res) => {
      const p = parseParams(retrieveSchema, req.query);
      res.json(render(store, expireIfDue(store, findSession(store, req.params.id)), p.expand));
    });

    // https://docs.stripe.com/api/checkout/sessions/expire — only an open session.
    router.post('/v1/checkout/sessions/:id/expire', (req, res) => {
      const p = parseParams(retrieveSchema, req.body);
      const session = expireIfDue(store, findSession(store, req.params.id));
      if (session.status !== 'open')
        throw stateError('checkout_session_unexpected_state', `Only Checkout Sessions with a status of open can be expired; this one is ${session.status}.`);
      res.json(render(store, expire(store, session, causeOf(req, res)), p.expand));
    });

    // The hosted page (the provider's own site, no API key): the renter types the card here.
    router.get('/pay/:id', (req, res) => {
      const session = sessionTable(store).get(req.params.id);
      if (!session)
        return res
          .status(404)
          .type('html')
          .send(hostedPage({ status: 'expired' } as CheckoutSession));
      res.type('html').send(hostedPage(expireIfDue(store, session)));
    });
    router.post('/pay/:id', express.urlencoded({ extended: false, limit: '8kb' }), (req, res) => {
      const found = sessionTable(store).get(req.params.id);
      if (!found)
        return res
          .status(404)
          .type('html')
          .send(hostedPage({ status: 'expired' } as CheckoutSession));
      const session = expireIfDue(store, found);
      const form = cardForm.parse(req.body ?? {});
      const typed = { number: form.cardNumber, expiry: form.expiry };
      if (session.status !== 'open') return res.status(409).type('html').send(hostedPage(session));
      const problem = cardProblem(store, form);
      if (problem)
        return res
          .status(402)
          .type('html')
          .send(hostedPage(session, problem, typed));
      const result = pay(store, session, form.cardNumber.replace(/[\s-]/g, ''));
      if (!result.ok)
        return res
          .status(402)
          .type('html')
          .send(hostedPage(sessionTable(store).get(session.id)!, result.message, typed));
      res.redirect(303, result.session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id));
    });

    return router;
  },
};
