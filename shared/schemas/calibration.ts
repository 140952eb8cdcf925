import { z } from 'zod';

export const asFoundResults = ['in_tolerance', 'out_of_tolerance', 'not_reported'] as const;
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date YYYY-MM-DD').refine((s) => !Number.isNaN(Date.parse(s)), 'is not a real date');

/** Multipart fields arrive as strings. */
export const calibrationEventFields = z.object({
  performedOn: isoDate,
  provider: z.string().trim().min(1, 'is required').max(120),
  certificateNumber: z.string().trim().min(1, 'is required').max(80),
  asFound: z.enum(asFoundResults, { message: `must be one of ${asFoundResults.join(', ')}` }),
  asLeft: z.enum(asFoundResults, { message: `must be one of ${asFoundResults.join(', ')}` }),
  intervalMonths: z.coerce.number().int('must be a whole number of months').min(1).max(120).optional(),
  note: z.string().trim().max(2000).optional(),
});

export const intervalDecisionPayload = z.object({ decision: z.enum(['accept', 'decline'], { message: 'must be accept or decline' }) });

export const labTripPayload = z
  .object({
    provider: z.string().trim().min(1, 'is required').max(120),
    assetIds: z.array(z.uuid('is not an asset id')).min(1, 'pick at least one item').max(100),
    sentOn: isoDate,
    expectedBackOn: isoDate.optional(),
  })
  .refine((t) => !t.expectedBackOn || t.expectedBackOn >= t.sentOn, { message: 'must be on or after the day it goes', path: ['expectedBackOn'] });

export const impactAssessments = ['no_effect', 'customer_notified', 'remeasure_offered'] as const;
export const impactAssessmentPayload = z.object({ assessment: z.enum(impactAssessments, { message: `must be one of ${impactAssessments.join(', ')}` }), note: z.string().trim().max(2000).optional() });
export const noticePayload = z.object({ send: z.boolean().default(false) });
