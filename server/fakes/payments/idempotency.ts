import { isDeepStrictEqual } from 'node:util';
import type { RequestHandler } from 'express';
import { ProviderError } from './errors';
import type { IdempotencyEntry, PaymentStore } from './store';

const KEY_LIFETIME_MS = 24 * 60 * 60 * 1000;

/**
 * The provider's idempotency rules for POST requests carrying `Idempotency-Key`:
 * a repeat with the same key and the same parameters gets the first response
 * back (with `Idempotent-Replayed: true`); the same key with other parameters or
 * another endpoint is refused; a repeat while the first is still running gets a
 * 409; server errors and parameter-validation errors are not kept. Keys live 24 h.
 */
export function idempotency(store: PaymentStore): RequestHandler {
  return (req, res, next) => {
    const header = req.get('idempotency-key');
    if (req.method !== 'POST' || !header) return next();
    if (header.length > 255) {
      return next(new ProviderError(400, { type: 'invalid_request_error', message: 'Idempotency-Key must be at most 255 characters.' }));
    }

    const now = store.clock();
    for (const [k, entry] of store.idempotency) {
      if (now - entry.createdAt > KEY_LIFETIME_MS) store.idempotency.delete(k);
    }

    const key = `${res.locals.apiKey}\u0000${header}`;
    const fingerprint = JSON.stringify({ path: req.path, body: req.body ?? {} });
    const existing = store.idempotency.get(key);
    if (existing) {
      const same = isDeepStrictEqual(JSON.parse(existing.fingerprint), JSON.parse(fingerprint));
      if (!same) {
        return next(
          new ProviderError(400, {
            type: 'idempotency_error',
            message: `Idempotency-Key '${header}' was first used with other parameters or another endpoint.`,
          }),
        );
      }
      if (!existing.response) {
        return next(
          new ProviderError(409, {
            type: 'idempotency_error',
            message: `A request with Idempotency-Key '${header}' is still being processed; retry shortly.`,
          }),
        );
      }
      res.set('Idempotent-Replayed', 'true');
      res.status(existing.response.status).json(existing.response.body);
      return;
    }

    const entry: IdempotencyEntry = { fingerprint, createdAt: now };
    store.idempotency.set(key, entry);
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      if (res.statusCode >= 500 || res.locals.skipIdempotency) store.idempotency.delete(key);
      else entry.response = { status: res.statusCode, body };
      return json(body);
    };
    // A request that ends without a JSON reply (client gone, crash) must not block the key.
    res.on('close', () => {
      if (!entry.response && store.idempotency.get(key) === entry) store.idempotency.delete(key);
    });
    next();
  };
}
