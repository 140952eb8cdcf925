/**
 * The firm's one voice for dates, times, money and measurements: screens, e-mails, PDFs, CSV headers and refusals all
 * format through here with the firm's locale and time zone (settings), so a reader never meets two styles.
 *
 * Calendar dates (`YYYY-MM-DD`) are already the firm's dates and never shift; moments (ISO timestamps) are shown as the
 * firm's wall-clock time. Formatters are made once per combination: each Intl formatter holds memory outside the heap.
 */
import { formatMoney } from '../billing/money';
import { isCalendarDate } from '../dates/calendar-date';

/** Locales a firm can choose; English text with the locale's dates, numbers and money. */
export const firmLocales = [
  'en-GB',
  'en-US',
  'en-IE',
  'en-AU',
  'en-CA',
  'de-DE',
  'de-AT',
  'de-CH',
  'fr-FR',
  'nl-NL',
  'it-IT',
  'es-ES',
  'sv-SE',
  'pl-PL',
] as const;
export type FirmLocale = (typeof firmLocales)[number];
export const DEFAULT_LOCALE: FirmLocale = 'en-GB';
export const isFirmLocale = (value: string): value is FirmLocale => (firmLocales as readonly string[]).includes(value);

/** The IANA time zone names this runtime knows (tz database), with UTC. */
export function timeZoneNames(): string[] {
  const names = Intl.supportedValuesOf('timeZone');
  return names.includes('UTC') ? names : ['UTC', ...names];
}
let knownZones: Set<string> | undefined;
export const isTimeZoneName = (value: string) => (knownZones ??= new Set(timeZoneNames())).has(value);

export type FirmVoice = { locale: string; timeZone: string; currency: string };

type Value = string | number | Date | null | undefined;
const NONE = '—';

const cache = new Map<string, Intl.DateTimeFormat | Intl.NumberFormat>();
function cached<T extends Intl.DateTimeFormat | Intl.NumberFormat>(key: string, make: () => T): T {
  let made = cache.get(key) as T | undefined;
  if (!made) cache.set(key, (made = make()));
  return made;
}

const asCalendarDay = (isoDate: string) => new Date(`${isoDate}T00:00:00Z`);
const asMoment = (value: string | number | Date) => (value instanceof Date ? value : new Date(value));

export type FirmFormat = ReturnType<typeof firmFormat>;

/**
 * `viewerTimeZone`: the reader's own zone when known (a browser). Times name their zone when it differs from the
 * reader's; on paper and in mail (reader unknown) they always do.
 */
export function firmFormat(voice: FirmVoice, viewerTimeZone?: string) {
  const { locale, timeZone, currency } = voice;
  const nameZone = viewerTimeZone !== timeZone;
  const dayFormat = cached(`d|${locale}`, () => new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }));
  const zoneDayFormat = cached(
    `dz|${locale}|${timeZone}`,
    () => new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone }),
  );
  const timeOptions: Intl.DateTimeFormatOptions = { hour: 'numeric', minute: '2-digit', timeZone, ...(nameZone ? { timeZoneName: 'short' } : {}) };
  const timeFormat = cached(`t|${locale}|${timeZone}|${nameZone}`, () => new Intl.DateTimeFormat(locale, timeOptions));
  const dateTimeFormat = cached(
    `dt|${locale}|${timeZone}|${nameZone}`,
    () => new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', ...timeOptions }),
  );
  const monthFormat = cached(`m|${locale}`, () => new Intl.DateTimeFormat(locale, { month: 'short', year: 'numeric', timeZone: 'UTC' }));
  const number = (value: number | null | undefined, digits = 1, grouping = true) =>
    value === null || value === undefined || Number.isNaN(value)
      ? NONE
      : cached(`n|${locale}|${digits}|${grouping}`, () => new Intl.NumberFormat(locale, { maximumFractionDigits: digits, useGrouping: grouping })).format(
          value,
        );
  const fixed = (value: number, digits: number) =>
    cached(
      `f|${locale}|${digits}`,
      () => new Intl.NumberFormat(locale, { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false }),
    ).format(value);

  /** A calendar date or the firm's date of a moment: "3 Dec 2026" (en-GB), "Dec 3, 2026" (en-US). */
  const date = (value: Value): string => {
    if (value === null || value === undefined || value === '') return NONE;
    if (typeof value === 'string' && isCalendarDate(value)) return dayFormat.format(asCalendarDay(value));
    const moment = asMoment(value);
    return Number.isNaN(moment.getTime()) ? String(value) : zoneDayFormat.format(moment);
  };
  const moment = (format: Intl.DateTimeFormat) => (value: Value) => {
    if (value === null || value === undefined || value === '') return NONE;
    const at = asMoment(value);
    return Number.isNaN(at.getTime()) ? String(value) : format.format(at);
  };

  return {
    locale,
    timeZone,
    currency,
    date,
    /** Two calendar dates, the year always shown: "7–11 Dec 2026", "23 Dec 2026 – 5 Jan 2027". */
    dateRange: (first: string, last: string): string =>
      isCalendarDate(first) && isCalendarDate(last) && first <= last
        ? dayFormat.formatRange(asCalendarDay(first), asCalendarDay(last))
        : `${date(first)} – ${date(last)}`,
    /** A calendar month `YYYY-MM`: "Dec 2026". */
    month: (isoMonth: string) => monthFormat.format(asCalendarDay(`${isoMonth}-01`)),
    /** A moment as the firm's date and time. */
    dateTime: moment(dateTimeFormat),
    /** A moment as the firm's time of day. */
    time: moment(timeFormat),
    /** Integer minor units in the firm's currency (or another ISO 4217 code). */
    money: (minor: number | null | undefined, otherCurrency?: string) => formatMoney(minor, otherCurrency ?? currency, locale),
    /** A count or measure with at most `digits` decimals. */
    number,
    /** A whole count with the locale's grouping: "1,250" / "1.250". */
    count: (value: number) => number(value, 0),
    /** A length in millimetres with fixed decimals and no grouping: "1250.000 mm". */
    mm: (value: number | null | undefined, digits = 3) => (value === null || value === undefined ? NONE : `${fixed(value, digits)} mm`),
    /** A small length in micrometres: "4.2 µm". */
    um: (value: number | null | undefined, digits = 1) => (value === null || value === undefined ? NONE : `${fixed(value, digits)} µm`),
    /**
     * A point's coordinates, each named and without grouping, so neither a thousands separator nor a decimal comma can
     * be read as the separator between coordinates: "X 1250.000 · Y −340.500 · Z 87.250 mm".
     */
    coordinate: (point: readonly [number, number, number] | { x: number; y: number; z: number }, digits = 3) => {
      const [x, y, z] = Array.isArray(point) ? point : [(point as { x: number }).x, (point as { y: number }).y, (point as { z: number }).z];
      return `X ${fixed(x, digits)} · Y ${fixed(y, digits)} · Z ${fixed(z, digits)} mm`;
    },
    /** The zone's name as the firm's clock says it, for a note beside times ("Europe/Berlin"). */
    zoneNote: nameZone ? `times in ${timeZone.replaceAll('_', ' ')}` : null,
  };
}
