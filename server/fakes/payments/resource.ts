import type { Router } from 'express';
import type { PaymentStore } from './store';

/** One provider resource (customers, payment intents, refunds …): one file each,
 * listed in `resources` in ../payment-fake.ts. */
export type PaymentResource = {
  name: string;
  router(store: PaymentStore): Router;
  /** Work the provider does on its own as time passes (e.g. lapsing uncaptured
   * authorizations); run after a test moves the clock and periodically. */
  sweep?(store: PaymentStore): void;
};
