import type { Router } from 'express';
import type { PaymentStore } from './store';

/** One provider resource (customers, payment intents, refunds …): one file each,
 * listed in `resources` in ../payment-fake.ts. */
export type PaymentResource = {
  name: string;
  router(store: PaymentStore): Router;
};
