import Stripe from 'stripe';
import type { Config } from '../config';

/** The payment provider's official SDK, pointed by host, port and protocol at
 * the provider — or, locally, at the fake in server/fakes. A call that times
 * out or meets a network error is retried by the SDK under the same
 * idempotency key, so the provider applies it once. */
export const createPaymentClient = (
  config: Pick<Config, 'PAYMENT_API_KEY' | 'PAYMENT_API_HOST' | 'PAYMENT_API_PORT' | 'PAYMENT_API_PROTOCOL' | 'PAYMENT_TIMEOUT_MS'>,
) =>
  new Stripe(config.PAYMENT_API_KEY, {
    host: config.PAYMENT_API_HOST,
    port: config.PAYMENT_API_PORT,
    protocol: config.PAYMENT_API_PROTOCOL,
    maxNetworkRetries: 2,
    timeout: config.PAYMENT_TIMEOUT_MS,
  });
