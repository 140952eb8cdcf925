import { createServer } from 'node:http';
import express from 'express';
import { requireApiKey } from './payments/auth';
import { charges } from './payments/charges';
import { checkoutSessions } from './payments/checkout-sessions';
import { controlRouter } from './payments/control';
import { customers } from './payments/customers';
import { errorHandler, unknownRoute } from './payments/errors';
import { events } from './payments/events';
import { faults } from './payments/faults';
import { idempotency } from './payments/idempotency';
import { paymentIntents } from './payments/payment-intents';
import { paymentMethods } from './payments/payment-methods';
import { refunds } from './payments/refunds';
import type { PaymentResource } from './payments/resource';
import { PaymentStore, randomToken } from './payments/store';
import { listen } from './listen';

/** The provider resources this fake serves; add one file per resource here. */
const resources: PaymentResource[] = [customers, paymentMethods, paymentIntents, checkoutSessions, charges, refunds, events];

/** How often the running fake does its time-driven work (lapsing authorizations). */
const SWEEP_INTERVAL_MS = 60_000;

/** Runs every resource's time-driven work once. */
export const sweepPaymentFake = (store: PaymentStore) => {
  for (const resource of resources) resource.sweep?.(store);
};

export type PaymentFakeOptions = {
  port?: number;
  /** Loopback by default; the container deployment binds its private network. */
  host?: string;
  /** When set, only this secret key is accepted; otherwise any `sk_test_` key. */
  apiKey?: string;
  webhookUrl?: string;
  webhookSecret?: string;
  /** Waits before each webhook re-delivery after a non-2xx answer (one entry per retry). */
  webhookRetryDelaysMs?: number[];
};

export type PaymentFake = {
  port: number;
  host: string;
  app: express.Express;
  store: PaymentStore;
  close(): Promise<void>;
};

/** Builds the fake's Express app over a store, without listening (for supertest). */
export function createPaymentFakeApp(store: PaymentStore): express.Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('etag', false);
  // The provider nests parameters in brackets (metadata[k]=v, expand[]=x) in bodies and query strings.
  app.set('query parser', 'extended');

  app.use((_req, res, next) => {
    res.set('Request-Id', `req_${randomToken(14)}`);
    next();
  });
  app.get('/health', (_req, res) => {
    res.json({ status: 'ok' });
  });
  // Test-only controls (clock, faults, webhook log); see ./payments/control.ts.
  app.use(
    '/__fake',
    controlRouter(store, () => sweepPaymentFake(store)),
  );
  app.use('/v1', express.urlencoded({ extended: true, limit: '1mb', parameterLimit: 2000 }));
  app.use('/v1', requireApiKey(store));
  // Before idempotency, so a "timeout" fault's response is still kept for replay.
  app.use('/v1', faults(store));
  app.use('/v1', idempotency(store));
  for (const resource of resources) app.use(resource.router(store));
  app.use(unknownRoute);
  app.use(errorHandler);
  return app;
}

export async function startPaymentFake(opts: PaymentFakeOptions = {}): Promise<PaymentFake> {
  const host = opts.host ?? '127.0.0.1';
  const store = new PaymentStore({
    apiKey: opts.apiKey,
    webhookUrl: opts.webhookUrl,
    webhookSecret: opts.webhookSecret,
    webhookRetryDelaysMs: opts.webhookRetryDelaysMs,
  });
  const app = createPaymentFakeApp(store);
  const server = createServer(app);
  const port = await listen(server, opts.port ?? 0, host);
  const sweeper = setInterval(() => sweepPaymentFake(store), SWEEP_INTERVAL_MS);
  sweeper.unref();
  return {
    port,
    host,
    app,
    store,
    close: () =>
      new Promise<void>((resolve, reject) => {
        clearInterval(sweeper);
        store.dispose();
        server.close((err) => (err ? reject(err) : resolve()));
        // The SDK keeps connections alive; do not wait for them to time out.
        server.closeAllConnections();
      }),
  };
}
