/**
 * Reading a date a person typed into a date field. The field shows dates as the firm's format prints them ("3 Dec 2026",
 * "Dec 3, 2026", "3. Dez. 2026"); people also type the locale's numeric style ("03/12/2026", "12/3/2026", "3.12.2026")
 * or ISO 8601 ("2026-12-03"). date-fns `parse` reads the text in the firm's locale, so the month names it knows are its
 * own tables, not the Intl that printed them.
 */
import { format, isValid, parse, type Locale } from 'date-fns';
import { de, deAT, enAU, enCA, enGB, enIE, enUS, es, fr, it, nl, pl, sv } from 'date-fns/locale';
import { isCalendarDate } from '../dates/calendar-date';
import { DEFAULT_LOCALE, isFirmLocale, type FirmLocale } from './firm-format';

/** date-fns has no Swiss German locale; its months and numeric style are those of `de`. */
const dateFnsLocales: Record<FirmLocale, Locale> = {
  'en-GB': enGB,
  'en-US': enUS,
  'en-IE': enIE,
  'en-AU': enAU,
  'en-CA': enCA,
  'de-DE': de,
  'de-AT': deAT,
  'de-CH': de,
  'fr-FR': fr,
  'nl-NL': nl,
  'it-IT': it,
  'es-ES': es,
  'sv-SE': sv,
  'pl-PL': pl,
};

/** The date-fns locale of a firm locale (the calendar's month names and first weekday). */
export const dateLocaleOf = (locale: string): Locale => dateFnsLocales[isFirmLocale(locale) ? locale : DEFAULT_LOCALE];

/** Dates with a month name, as the firm's format and its longer or shorter neighbours write them. */
const namedMonthPatterns = [
  'PP',
  'PPP',
  'd MMM yyyy',
  'd. MMM yyyy',
  'MMM d, yyyy',
  'MMM d yyyy',
  'd MMMM yyyy',
  'd. MMMM yyyy',
  'MMMM d, yyyy',
  'MMMM d yyyy',
];
const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;
/** A reference for fields the text leaves out; every pattern here names day, month and year, so it never shows. */
const REFERENCE = new Date(2000, 0, 1);

/**
 * Spellings the date-fns tables do not match as printed: ICU writes "Sept" (en-GB, de, es) and "June"/"July" (en-AU)
 * where date-fns abbreviates to three letters, and Dutch without the dot date-fns expects ("3 dec 2026"). Each variant is
 * only tried after the text as typed.
 */
const variants = (text: string) => [
  text,
  text.replace(/\p{L}{4,}/gu, (word) => word.slice(0, 3)),
  text.replace(/(\p{L}{3})(?![\p{L}.])/gu, '$1.'),
  text.replace(/\p{L}{4,}/gu, (word) => `${word.slice(0, 3)}.`).replace(/\.\./g, '.'),
];

/**
 * The ISO calendar date (`YYYY-MM-DD`) a person meant, or null when the text is not one whole, real date with a
 * four-digit year (no 31 February, nothing left over).
 */
export function parseTypedDate(typed: string, locale: string): string | null {
  const text = typed
    .normalize('NFC')
    .replace(/[\s\u00a0\u202f]+/g, ' ')
    .trim();
  if (!text) return null;
  if (ISO_DATE.test(text)) return isCalendarDate(text) ? text : null;
  if (!/\d{4}/.test(text)) return null;
  const dateLocale = dateLocaleOf(locale);
  const numeric = /^[\d\s./-]+$/.test(text);
  const patterns = numeric ? ['P'] : namedMonthPatterns;
  for (const candidate of numeric ? [text] : variants(text)) {
    for (const pattern of patterns) {
      const day = parse(candidate, pattern, REFERENCE, { locale: dateLocale });
      if (!isValid(day)) continue;
      const iso = format(day, 'yyyy-MM-dd');
      if (isCalendarDate(iso)) return iso;
    }
  }
  return null;
}
