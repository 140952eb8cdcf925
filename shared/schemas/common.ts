import { z } from 'zod';
import { calendarDateProblem } from '../dates/calendar-date';

/**
 * The building blocks every payload schema uses for text, dates and e-mail
 * addresses, so a rule about them is written once.
 */

/** A NUL (PostgreSQL text cannot hold it) or a UTF-16 surrogate without its partner (not text at all; JSONB refuses it). */
const UNSTORABLE = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
export const UNSTORABLE_TEXT = 'contains a character that is not text (NUL or a broken surrogate pair)';
export const isStorableText = (value: string) => !UNSTORABLE.test(value);

/** Free text: trimmed, at most `max` characters, only characters that can be stored. Add `.min()` where it is required. */
export const text = (max: number) =>
  z.string({ message: 'must be text' }).refine(isStorableText, UNSTORABLE_TEXT).trim().max(max, `must be at most ${max} characters`);

/** A calendar date `YYYY-MM-DD` that exists (no 30 February), within the product's years. */
export const calendarDate = z
  .string({ message: 'must be a date YYYY-MM-DD' })
  .superRefine((value, ctx) => {
    const problem = calendarDateProblem(value);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  })
  .meta({ format: 'date' });

/** A moment, ISO 8601 with an offset (API.md: timestamps), whose date lies within the same years. */
export const instant = z.iso
  .datetime({ offset: true, message: 'must be a date and time' })
  .refine((value) => calendarDateProblem(value.slice(0, 10)) === null, 'must be a real date and time between 1900 and 2199');

/** A calendar month `YYYY-MM`, within the same years. */
export const calendarMonth = z
  .string({ message: 'must be a month YYYY-MM' })
  .refine((value) => /^\d{4}-\d{2}$/.test(value) && calendarDateProblem(`${value}-01`) === null, 'must be a month YYYY-MM')
  .meta({ format: 'month' });

/** RFC 5321 §4.5.3.1.3: a path is at most 256 octets with its angle brackets, so an address at most 254.
 * Checked first, so an oversize value never reaches the address pattern or an index. */
export const MAX_EMAIL_LENGTH = 254;
export const emailAddress = z
  .string({ message: 'is not an e-mail address' })
  .trim()
  .max(MAX_EMAIL_LENGTH, { message: `must be at most ${MAX_EMAIL_LENGTH} characters`, abort: true })
  .toLowerCase()
  .email('is not an e-mail address');
