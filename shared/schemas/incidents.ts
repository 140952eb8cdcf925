import { z } from 'zod';
import { incidentKinds, incidentStates } from '../incidents/vocabulary';
import { instant, text } from './common';

export * from '../incidents/vocabulary';

/** Multipart text fields arrive as strings. */
export const incidentPayload = z.object({
  /** Made on the phone when the report is written: the record's id and its idempotency key (a resend returns the stored report). */
  id: z
    .uuid('is not a record id (UUID)')
    .optional()
    .or(z.literal('').transform(() => undefined)),
  assetId: z.uuid('is not an asset id'),
  kind: z.enum(incidentKinds, { message: `must be one of ${incidentKinds.join(', ')}` }),
  description: text(4000).min(3, 'say briefly what happened'),
  occurredAt: instant,
  location: text(200)
    .optional()
    .transform((v) => v || null),
  bookingId: z
    .uuid('is not a booking id')
    .optional()
    .or(z.literal('').transform(() => undefined)),
});

export const incidentUpdatePayload = z
  .object({
    state: z.enum(incidentStates).optional(),
    resolution: text(4000).nullable().optional(),
    chargeAmountMinor: z.number().int('must be whole minor units').min(0, 'cannot be negative').max(1e9).nullable().optional(),
  })
  .strict();

export const incidentListQuery = z.object({
  assetId: z.uuid().optional(),
  state: z.preprocess((v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v), z.array(z.enum(incidentStates))).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});

export const releasePayload = z.object({ note: text(2000).optional() });
export const holdPayload = z.object({ summary: text(500).min(3, 'say why the item is held') });
