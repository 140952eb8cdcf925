import { z } from 'zod';
import { fromZodError, ProviderError } from './errors';

/** Parameters every endpoint accepts (the SDK may send them). */
export const common = {
  expand: z.array(z.string()).optional(),
};

/** `metadata[k]=v` sets a key, `metadata[k]=` removes it, `metadata=` clears all. */
export const metadataParam = z.union([z.literal(''), z.record(z.string().min(1).max(40), z.string().max(500))]).optional();

export type Metadata = Record<string, string>;

export function applyMetadata(current: Metadata, update: z.infer<typeof metadataParam>): Metadata {
  if (update === undefined) return current;
  if (update === '') return {};
  const next = { ...current };
  for (const [k, v] of Object.entries(update)) {
    if (v === '') delete next[k];
    else next[k] = v;
  }
  return next;
}

/** Empty string means "unset" for optional text fields in the form encoding. */
export const nullableText = z.string().max(5000).optional();
export const textOrNull = (v: string | undefined, current: string | null = null) => (v === undefined ? current : v === '' ? null : v);

/** Form values arrive as strings; `limit=10` → 10. */
export const formInt = z
  .string()
  .regex(/^-?\d+$/, 'expected an integer')
  .transform(Number);

/** Form booleans arrive as "true" / "false". */
export const formBool = z.enum(['true', 'false']).transform((v) => v === 'true');

/** A positive amount in the currency's smallest unit (https://docs.stripe.com/currencies#zero-decimal). */
export const formAmount = formInt.pipe(z.number().int().min(1).max(99_999_999));

/**
 * The provider's per-currency amount rules (https://docs.stripe.com/currencies):
 * three-decimal currencies need a last digit of 0 ("Three-decimal currencies");
 * ISK, zero-decimal at the card networks since 14 April 2023, is still sent with
 * two decimals and must be evenly divisible by 100 ("Special cases"; the error code
 * from support.stripe.com "Deprecation of fractional ISK charges and refunds").
 * Zero-decimal currencies take any integer, which `formAmount` already is.
 */
export function assertAcceptedAmount(amount: number, currency: string, param: string): void {
  // Parameter errors, so not kept for idempotent replay (like the schema's own).
  const refuse = (message: string, code?: string) =>
    new ProviderError(400, { type: 'invalid_request_error', message, param, ...(code ? { code } : {}) }, false);
  if (['bhd', 'jod', 'kwd', 'omr', 'tnd'].includes(currency) && amount % 10 !== 0) {
    throw refuse(`Invalid amount: ${currency.toUpperCase()} amounts must end in 0 (round to the nearest ten).`);
  }
  if (currency === 'isk' && amount % 100 !== 0) {
    throw refuse(
      'Invalid amount. Currency ISK has become effectively zero-decimal and charged amounts must be evenly divisible by 100.',
      'invalid_charge_amount_no_decimal_compatible',
    );
  }
}

/** Three-letter ISO currency code, lower-cased as the provider returns it. */
export const currencyParam = z
  .string()
  .regex(/^[A-Za-z]{3}$/, 'expected a three-letter ISO currency code')
  .transform((c) => c.toLowerCase());

export const listParams = {
  limit: formInt.pipe(z.number().int().min(1).max(100)).optional(),
  starting_after: z.string().optional(),
  ending_before: z.string().optional(),
};

/** Validates a form body / query against a strict schema, in the provider's error shape. */
export function parseParams<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  const result = schema.safeParse(input ?? {});
  if (!result.success) throw fromZodError(result.error, input);
  return result.data;
}

/** A list page in the provider's shape, newest first, cursor-paginated by id. */
export function listPage<T extends { id: string; created: number }>(
  url: string,
  all: T[],
  params: { limit?: number; starting_after?: string; ending_before?: string },
) {
  const sorted = [...all].reverse(); // insertion order is creation order
  const limit = params.limit ?? 10;
  let start = 0;
  let end = sorted.length;
  if (params.starting_after) start = sorted.findIndex((o) => o.id === params.starting_after) + 1;
  if (params.ending_before) {
    end = Math.max(
      0,
      sorted.findIndex((o) => o.id === params.ending_before),
    );
    start = Math.max(start, end - limit);
  }
  const data = sorted.slice(start, Math.min(end, start + limit));
  return { object: 'list' as const, url, has_more: start + data.length < end, data };
}
