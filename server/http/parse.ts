import type { z } from 'zod';
import { invalidInput } from './errors';

/** Parse a request part with its zod schema or throw the API's 400. */
export function parse<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
  const result = schema.safeParse(value ?? {});
  if (!result.success) throw invalidInput(result.error);
  return result.data;
}
