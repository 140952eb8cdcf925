import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ZodError } from 'zod';
import { fakesLog } from '../log';

/** The provider's error body: `{error: {type, message, code?, param?}}`. The SDK
 * picks its error class from the HTTP status and `type`, and exposes `code`. */
export type ProviderErrorBody = {
  type: 'invalid_request_error' | 'idempotency_error' | 'card_error' | 'api_error' | 'authentication_error';
  message: string;
  code?: string;
  param?: string;
  decline_code?: string;
  /** Card errors and state errors on intents carry the objects involved. */
  charge?: string;
  payment_intent?: unknown;
  payment_method?: unknown;
  doc_url?: string;
};

export class ProviderError extends Error {
  constructor(
    readonly status: number,
    readonly body: ProviderErrorBody,
    /** Parameter validation failures are not kept for idempotent replay (the provider's rule). */
    readonly replayable = true,
  ) {
    super(body.message);
  }
}

export const invalidRequest = (message: string, extra: Omit<ProviderErrorBody, 'type' | 'message'> = {}) =>
  new ProviderError(400, { type: 'invalid_request_error', message, ...extra });

/** A request that is valid but not allowed in the object's current state
 * (https://docs.stripe.com/error-codes, e.g. `payment_intent_unexpected_state`). */
export const stateError = (code: string, message: string, extra: Omit<ProviderErrorBody, 'type' | 'message' | 'code'> = {}) =>
  new ProviderError(400, { type: 'invalid_request_error', code, message, ...extra });

/** `resource` is the provider's lower-case name, e.g. "customer", "payment_intent". */
export const resourceMissing = (resource: string, id: string, param = 'id') =>
  new ProviderError(404, {
    type: 'invalid_request_error',
    code: 'resource_missing',
    param,
    message: `There is no ${resource} with id '${id}'.`,
  });

/** Form-style parameter path, as the provider reports it: ['metadata','k'] → "metadata[k]". */
export function paramPath(path: ReadonlyArray<PropertyKey>): string {
  const [head, ...rest] = path.map(String);
  return (head ?? '') + rest.map((p) => `[${p}]`).join('');
}

export function fromZodError(error: ZodError, input: unknown): ProviderError {
  const issue = error.issues[0]!;
  if (issue.code === 'unrecognized_keys') {
    const param = paramPath([...issue.path, issue.keys[0]!]);
    return new ProviderError(400, { type: 'invalid_request_error', code: 'parameter_unknown', param, message: `Unknown parameter: ${param}.` }, false);
  }
  const param = paramPath(issue.path);
  let value: unknown = input;
  for (const key of issue.path) value = (value as Record<PropertyKey, unknown> | undefined)?.[key];
  if (value === undefined) {
    return new ProviderError(400, { type: 'invalid_request_error', code: 'parameter_missing', param, message: `Required parameter missing: ${param}.` }, false);
  }
  return new ProviderError(
    400,
    { type: 'invalid_request_error', code: 'parameter_invalid', param, message: `Invalid value for ${param}: ${issue.message}` },
    false,
  );
}

export const unknownRoute: RequestHandler = (req, _res, next) => {
  next(
    new ProviderError(404, {
      type: 'invalid_request_error',
      message: `This payment fake does not serve ${req.method} ${req.path}.`,
    }),
  );
};

/** Turns every error into the provider's shape; body-parser errors become 400s. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof ProviderError) {
    if (!err.replayable) res.locals.skipIdempotency = true;
    res.status(err.status).json({ error: err.body });
    return;
  }
  const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
  if (status < 500) {
    res.locals.skipIdempotency = true;
    res.status(status).json({ error: { type: 'invalid_request_error', message: `Malformed request: ${err.message}` } });
    return;
  }
  fakesLog.error({ err }, 'payment fake failed unexpectedly');
  res.status(500).json({ error: { type: 'api_error', message: 'The payment fake failed unexpectedly.' } });
};
