import { z } from 'zod';
import { calendarDate, text } from './common';

export const asFoundResults = ['in_tolerance', 'out_of_tolerance', 'not_reported'] as const;

/** Multipart fields arrive as strings. */
export const calibrationEventFields = z.object({
  performedOn: calendarDate,
  provider: text(120).min(1, 'is required'),
  certificateNumber: text(80).min(1, 'is required'),
  asFound: z.enum(asFoundResults, { message: `must be one of ${asFoundResults.join(', ')}` }),
  /** The largest as-found error the certificate states, in µm (multipart: a blank field is none). */
  asFoundErrorUm: z.preprocess(
    (v) => (v === '' || v === null ? undefined : v),
    z.coerce.number({ message: 'must be a number of micrometres' }).min(0, 'cannot be negative').max(100_000).optional(),
  ),
  asLeft: z.enum(asFoundResults, { message: `must be one of ${asFoundResults.join(', ')}` }),
  intervalMonths: z.coerce.number().int('must be a whole number of months').min(1).max(120).optional(),
  note: text(2000).optional(),
});

export const intervalDecisionPayload = z.object({ decision: z.enum(['accept', 'decline'], { message: 'must be accept or decline' }) });

/** One trip for several items: `?assetIds=a,b,c`. */
export const labWindowsQuery = z.object({
  assetIds: z.preprocess(
    (v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v),
    z.array(z.uuid('is not an asset id')).min(1, 'pick at least one item').max(100),
  ),
});

export const labTripPayload = z
  .object({
    provider: text(120).min(1, 'is required'),
    assetIds: z.array(z.uuid('is not an asset id')).min(1, 'pick at least one item').max(100),
    sentOn: calendarDate,
    expectedBackOn: calendarDate.optional(),
  })
  .refine((t) => !t.expectedBackOn || t.expectedBackOn >= t.sentOn, { message: 'must be on or after the day it goes', path: ['expectedBackOn'] });

export const impactAssessments = ['no_effect', 'customer_notified', 'remeasure_offered'] as const;
export const impactAssessmentPayload = z.object({
  assessment: z.enum(impactAssessments, { message: `must be one of ${impactAssessments.join(', ')}` }),
  note: text(2000).optional(),
});
/** A notice as the person edited it before sending; matched to its draft by address and group. */
const editedNotice = z.object({
  to: z.string().max(254),
  group: z.enum([...impactAssessments, 'pending'], { message: 'must be a notice group' }),
  subject: text(200).min(1, 'a notice needs a subject'),
  text: text(20_000).min(1, 'a notice needs its text'),
});
export const noticePayload = z.object({ send: z.boolean().default(false), notices: z.array(editedNotice).max(200).optional() });
export type NoticeEdit = z.infer<typeof editedNotice>;
