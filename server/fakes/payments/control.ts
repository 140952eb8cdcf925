import express, { Router } from 'express';
import { z } from 'zod';
import { webhookAttempts } from './events';
import { addFault, faultSchema, faultTable } from './faults';
import { ageAuthorization } from './payment-intents';
import { parseParams } from './params';
import type { PaymentStore } from './store';

const clockSchema = z.strictObject({
  advanceSeconds: z.coerce
    .number()
    .min(0)
    .max(10 * 365 * 24 * 60 * 60),
});
const ageSchema = z.strictObject({
  seconds: z.coerce
    .number()
    .int()
    .min(0)
    .max(30 * 24 * 60 * 60),
});

/**
 * Test-only control endpoints of the payment-provider fake, outside /v1 (the
 * SDK never calls them), JSON or form bodies:
 *  - POST /__fake/clock {advanceSeconds} — moves the fake's clock forward, then
 *    runs the time-driven work (lapsing authorizations); GET /__fake/clock reads it;
 *  - POST /__fake/faults {path, mode, times, method?, hangMs?, declineCode?} —
 *    see ./faults.ts; GET lists pending faults, DELETE clears them;
 *  - GET /__fake/webhooks — every webhook delivery attempt so far;
 *  - POST /__fake/authorizations/:id/age {seconds} — an uncaptured hold started that much earlier;
 *  - POST /__fake/reset — forgets every object, key, fault and clock advance.
 */
export function controlRouter(store: PaymentStore, sweep: () => void): Router {
  const router = Router();
  router.use(express.json({ limit: '64kb' }), express.urlencoded({ extended: true, limit: '64kb' }));

  const clockView = () => ({ now: store.nowSeconds(), nowIso: new Date(store.clock()).toISOString() });

  router.get('/clock', (_req, res) => {
    res.json(clockView());
  });
  router.post('/clock', (req, res) => {
    const p = parseParams(clockSchema, req.body);
    store.advanceClock(p.advanceSeconds);
    sweep();
    res.json(clockView());
  });

  router.get('/faults', (_req, res) => {
    res.json({ data: [...faultTable(store).values()] });
  });
  router.post('/faults', (req, res) => {
    res.json(addFault(store, parseParams(faultSchema, req.body)));
  });
  router.delete('/faults', (_req, res) => {
    faultTable(store).clear();
    res.json({ data: [] });
  });

  router.get('/webhooks', (_req, res) => {
    res.json({ data: [...webhookAttempts(store).values()] });
  });

  router.post('/authorizations/:id/age', (req, res) => {
    const intent = ageAuthorization(store, req.params.id, parseParams(ageSchema, req.body).seconds);
    sweep();
    res.json(intent);
  });

  router.post('/reset', (_req, res) => {
    store.reset();
    res.json({ reset: true });
  });

  return router;
}
