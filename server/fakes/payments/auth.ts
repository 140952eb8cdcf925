import type { RequestHandler } from 'express';
import { ProviderError } from './errors';
import type { PaymentStore } from './store';

const unauthorized = (message: string) => new ProviderError(401, { type: 'invalid_request_error', message });

/** Secret key from `Authorization: Bearer sk_test_…` (or Basic with the key as user name). */
export function requireApiKey(store: PaymentStore): RequestHandler {
  return (req, res, next) => {
    const header = req.get('authorization') ?? '';
    let key = '';
    const [scheme, value = ''] = header.split(' ', 2);
    if (/^bearer$/i.test(scheme ?? '')) key = value.trim();
    else if (/^basic$/i.test(scheme ?? '')) key = Buffer.from(value, 'base64').toString('utf8').split(':')[0] ?? '';

    if (!key) return next(unauthorized('No API key was sent. Send your secret key as "Authorization: Bearer sk_test_…".'));
    if (!key.startsWith('sk_test_')) {
      return next(unauthorized('This local payment fake accepts test-mode secret keys (sk_test_…) only.'));
    }
    if (store.settings.apiKey && key !== store.settings.apiKey) {
      return next(unauthorized('The API key sent does not match the key this payment fake was started with.'));
    }
    res.locals.apiKey = key;
    next();
  };
}
