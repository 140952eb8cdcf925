import { createHmac } from 'node:crypto';
import { Router, type Request } from 'express';
import { z } from 'zod';
import { resourceMissing } from './errors';
import { common, listPage, listParams, parseParams } from './params';
import type { PaymentResource } from './resource';
import type { PaymentStore } from './store';

/** The API version stamped on events when the request that caused them sent none
 * (the SDK always sends `Stripe-Version`). */
const FALLBACK_API_VERSION = '2026-10-28.endive';

/** Event object, https://docs.stripe.com/api/events/object. */
export type ProviderEvent = {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: unknown; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
};

/** One attempt to POST an event to the configured endpoint (test-only log, GET /__fake/webhooks). */
export type WebhookAttempt = {
  event: string;
  type: string;
  attempt: number;
  at: number;
  status: number | null;
  error: string | null;
};

/** Waits between re-deliveries when the endpoint does not answer 2xx. The
 * provider retries for days with exponential backoff (https://docs.stripe.com/webhooks#retries);
 * the payment-provider fake retries a few times, growing from seconds. */
const DEFAULT_RETRY_DELAYS_MS = [1_000, 5_000, 25_000];
const DELIVERY_TIMEOUT_MS = 10_000;

export const eventTable = (store: PaymentStore) => store.table<ProviderEvent>('events');
export const webhookAttempts = (store: PaymentStore) => store.table<WebhookAttempt>('webhook_attempts');

/** What the request that caused an event looked like, for `event.request` and `api_version`. */
export type EventCause = { requestId?: string | null; idempotencyKey?: string | null; apiVersion?: string | null };

export function causeOf(req: Request | undefined, res?: { get(name: string): unknown }): EventCause {
  if (!req) return {};
  const requestId = res?.get('Request-Id');
  return {
    requestId: typeof requestId === 'string' ? requestId : null,
    idempotencyKey: req.get('idempotency-key') ?? null,
    apiVersion: req.get('stripe-version') ?? null,
  };
}

/**
 * The `Stripe-Signature` header as the reference describes it
 * (https://docs.stripe.com/webhooks#verify-manually): `t=<unix seconds>,v1=<hex
 * HMAC-SHA256 of "<t>.<raw payload>" keyed with the endpoint secret>`.
 */
export function signPayload(payload: string, secret: string, timestampSeconds: number): string {
  const signature = createHmac('sha256', secret).update(`${timestampSeconds}.${payload}`, 'utf8').digest('hex');
  return `t=${timestampSeconds},v1=${signature}`;
}

/**
 * Records an event (https://docs.stripe.com/api/events) for a state change and,
 * when an endpoint and secret are configured, POSTs it there signed. `object` is
 * snapshotted now, as the provider sends the object as it was at the change.
 */
export function emitEvent(
  store: PaymentStore,
  type: string,
  object: unknown,
  cause: EventCause = {},
  previousAttributes?: Record<string, unknown>,
): ProviderEvent {
  const deliver = Boolean(store.settings.webhookUrl && store.settings.webhookSecret);
  const event: ProviderEvent = {
    id: store.newId('evt'),
    object: 'event',
    api_version: cause.apiVersion ?? FALLBACK_API_VERSION,
    created: store.nowSeconds(),
    data: {
      object: structuredClone(object),
      ...(previousAttributes ? { previous_attributes: structuredClone(previousAttributes) } : {}),
    },
    livemode: false,
    pending_webhooks: deliver ? 1 : 0,
    request: { id: cause.requestId ?? null, idempotency_key: cause.idempotencyKey ?? null },
    type,
  };
  eventTable(store).set(event.id, event);
  if (deliver) store.schedule(() => void deliverEvent(store, event, 1), 0);
  return event;
}

async function deliverEvent(store: PaymentStore, event: ProviderEvent, attempt: number): Promise<void> {
  const { webhookUrl, webhookSecret } = store.settings;
  if (!webhookUrl || !webhookSecret || store.isDisposed) return;
  // The provider pretty-prints the body; the signature covers these exact bytes.
  const payload = JSON.stringify(event, null, 2);
  // Each attempt is signed afresh with the wall-clock time of sending, so a
  // receiver's tolerance check (default 300 s in the SDK) sees a current
  // timestamp even when a test has moved the fake's business clock.
  const header = signPayload(payload, webhookSecret, Math.floor(Date.now() / 1000));
  const controller = store.abortController();
  const timeout = setTimeout(() => controller.abort(), DELIVERY_TIMEOUT_MS);
  timeout.unref();
  const record: WebhookAttempt = { event: event.id, type: event.type, attempt, at: Date.now(), status: null, error: null };
  try {
    const response = await fetch(webhookUrl, {
      method: 'POST',
      headers: {
        'Content-Type': 'application/json; charset=utf-8',
        'Stripe-Signature': header,
        'User-Agent': 'nestkeeper-payment-fake/1.0 (+webhooks)',
      },
      body: payload,
      signal: controller.signal,
    });
    record.status = response.status;
    await response.arrayBuffer().catch(() => undefined);
  } catch (err) {
    record.error = err instanceof Error ? err.message : String(err);
  } finally {
    clearTimeout(timeout);
    store.releaseAbortController(controller);
  }
  if (store.isDisposed) return;
  webhookAttempts(store).set(`${event.id}#${attempt}`, record);

  const ok = record.status !== null && record.status >= 200 && record.status < 300;
  if (ok) {
    event.pending_webhooks = 0;
    return;
  }
  const delays = store.settings.webhookRetryDelaysMs ?? DEFAULT_RETRY_DELAYS_MS;
  const delay = delays[attempt - 1];
  if (delay === undefined) return; // gave up; the event stays retrievable with pending_webhooks 1
  store.schedule(() => void deliverEvent(store, event, attempt + 1), delay);
}

const retrieveSchema = z.strictObject(common);
const listSchema = z.strictObject({
  ...common,
  ...listParams,
  type: z.string().optional(),
  types: z.array(z.string()).optional(),
  delivery_success: z.enum(['true', 'false']).optional(),
});

/** Matches `type` filters, which may end in `*` (https://docs.stripe.com/api/events/list). */
const typeMatches = (pattern: string, type: string) => (pattern.endsWith('*') ? type.startsWith(pattern.slice(0, -1)) : pattern === type);

export const events: PaymentResource = {
  name: 'events',
  router(store) {
    const router = Router();
    const table = eventTable(store);

    // https://docs.stripe.com/api/events/list
    router.get('/v1/events', (req, res) => {
      const p = parseParams(listSchema, req.query);
      const all = [...table.values()].filter((e) => {
        if (p.type && !typeMatches(p.type, e.type)) return false;
        if (p.types && !p.types.some((t) => typeMatches(t, e.type))) return false;
        if (p.delivery_success !== undefined && (e.pending_webhooks === 0) !== (p.delivery_success === 'true')) return false;
        return true;
      });
      res.json(listPage('/v1/events', all, p));
    });

    // https://docs.stripe.com/api/events/retrieve
    router.get('/v1/events/:id', (req, res) => {
      parseParams(retrieveSchema, req.query);
      const event = table.get(req.params.id);
      if (!event) throw resourceMissing('event', req.params.id, 'id');
      res.json(event);
    });

    return router;
  },
};
