import type { RequestHandler } from 'express';
import { z } from 'zod';
import { ProviderError } from './errors';
import type { PaymentStore } from './store';

/**
 * Test-only fault injection (POST /__fake/faults): the next `times` requests
 * matching `path` (segments starting with `:` match any one segment, e.g.
 * `/v1/payment_intents/:id/capture`) and, if given, `method`:
 *  - `timeout`: the operation is applied and its response kept for idempotent
 *    replay, as the provider would, but the reply is withheld for `hangMs`
 *    (default 30 s) — past the client's timeout — or until the client hangs up;
 *  - `500`: answered 500 in the provider's error shape (https://docs.stripe.com/api/errors,
 *    type `api_error`), nothing applied, nothing kept for replay;
 *  - `decline`: confirmations (POST /v1/payment_intents with confirm=true, POST
 *    /v1/payment_intents/:id/confirm) decline with `declineCode` (default
 *    `generic_decline`) exactly as a declining card would; any other path is
 *    answered with a 402 card error without being applied.
 */
export const faultSchema = z.strictObject({
  path: z.string().startsWith('/v1/'),
  method: z
    .string()
    .transform((m) => m.toUpperCase())
    .optional(),
  mode: z.enum(['timeout', '500', 'decline']),
  times: z.coerce.number().int().min(1).max(1000).default(1),
  hangMs: z.coerce.number().int().min(0).max(600_000).optional(),
  declineCode: z.enum(['generic_decline', 'insufficient_funds']).optional(),
});

export type Fault = z.infer<typeof faultSchema> & { id: string; remaining: number };

export const faultTable = (store: PaymentStore) => store.table<Fault>('__faults');

const DEFAULT_HANG_MS = 30_000;

export function addFault(store: PaymentStore, input: z.infer<typeof faultSchema>): Fault {
  const fault: Fault = { ...input, id: store.newId('fault'), remaining: input.times };
  faultTable(store).set(fault.id, fault);
  return fault;
}

function pathMatches(pattern: string, path: string): boolean {
  const want = pattern.replace(/\/+$/, '').split('/');
  const got = path.replace(/\/+$/, '').split('/');
  return want.length === got.length && want.every((seg, i) => (seg.startsWith(':') ? got[i]!.length > 0 : seg === got[i]));
}

/** Takes one use of the first fault matching this request, if any. */
function takeFault(store: PaymentStore, method: string, path: string): Fault | undefined {
  for (const [id, fault] of faultTable(store)) {
    if (fault.method && fault.method !== method) continue;
    if (!pathMatches(fault.path, path)) continue;
    fault.remaining -= 1;
    if (fault.remaining <= 0) faultTable(store).delete(id);
    return fault;
  }
  return undefined;
}

const CONFIRMING = [/^\/v1\/payment_intents$/, /^\/v1\/payment_intents\/[^/]+\/confirm$/];

/** Mounted on /v1 after authentication and before idempotency, so a timed-out
 * request's response is still recorded under its Idempotency-Key. */
export function faults(store: PaymentStore): RequestHandler {
  return (req, res, next) => {
    const path = req.baseUrl + req.path;
    const fault = takeFault(store, req.method, path);
    if (!fault) return next();

    if (fault.mode === '500') {
      return next(
        new ProviderError(500, {
          type: 'api_error',
          message: 'The payment fake was told to fail this request (test fault). Nothing was applied.',
        }),
      );
    }

    if (fault.mode === 'decline') {
      const declineCode = fault.declineCode ?? 'generic_decline';
      if (req.method === 'POST' && CONFIRMING.some((re) => re.test(path))) {
        res.locals.forcedDecline = declineCode;
        return next();
      }
      return next(
        new ProviderError(402, {
          type: 'card_error',
          code: 'card_declined',
          decline_code: declineCode,
          message: declineCode === 'insufficient_funds' ? 'Your card has insufficient funds.' : 'Your card was declined.',
        }),
      );
    }

    // timeout: let the operation run, hold the reply back.
    const send = res.json.bind(res);
    let timer: NodeJS.Timeout | undefined;
    let gone = false;
    res.on('close', () => {
      gone = true;
      store.cancelScheduled(timer);
    });
    res.json = (body: unknown) => {
      timer = store.schedule(() => {
        if (!gone) send(body);
      }, fault.hangMs ?? DEFAULT_HANG_MS);
      return res;
    };
    next();
  };
}
