import Stripe from 'stripe';
import type { Config } from '../config';

/** The payment provider's official SDK, pointed by host, port and protocol at
 * the provider — or, locally, at the fake in server/fakes. */
export const createPaymentClient = (config: Pick<Config, 'PAYMENT_API_KEY' | 'PAYMENT_API_HOST' | 'PAYMENT_API_PORT' | 'PAYMENT_API_PROTOCOL'>) =>
  new Stripe(config.PAYMENT_API_KEY, {
    host: config.PAYMENT_API_HOST,
    port: config.PAYMENT_API_PORT,
    protocol: config.PAYMENT_API_PROTOCOL,
    maxNetworkRetries: 2,
    timeout: 15_000,
  });
