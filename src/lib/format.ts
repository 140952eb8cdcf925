import { createContext, useContext } from 'react';
import { DEFAULT_LOCALE, firmFormat, type FirmFormat, type FirmVoice } from '../../shared/formatting/firm-format';
import { formatMoney as formatMoneyIn } from '../../shared/billing/money';

/**
 * Every screen formats dates, times, money and numbers in the firm's locale and time zone (settings), through the same
 * shared module the server uses for mails and PDFs. The signed-in shell (or a public page that knows its firm) provides
 * the firm's voice; the plain functions below read the voice last provided, so code outside components agrees too.
 */
const viewerTimeZone = Intl.DateTimeFormat().resolvedOptions().timeZone;
const beforeSignIn: FirmVoice = { locale: DEFAULT_LOCALE, timeZone: viewerTimeZone, currency: 'EUR' };

let current: FirmFormat = firmFormat(beforeSignIn, viewerTimeZone);
export const FirmFormatContext = createContext<FirmFormat>(current);

/** The firm's format for a voice; also makes it the one the plain functions use. */
export function adoptFirmVoice(voice: FirmVoice): FirmFormat {
  if (current.locale !== voice.locale || current.timeZone !== voice.timeZone || current.currency !== voice.currency) {
    current = firmFormat(voice, viewerTimeZone);
  }
  return current;
}

/** The firm's formatters inside a component. */
export const useFirmFormat = () => useContext(FirmFormatContext);

type Value = string | number | Date | null | undefined;
export const formatDateTime = (value: Value) => current.dateTime(value);
export const formatDate = (value: Value) => current.date(value);
/** A calendar date `YYYY-MM-DD` (already the firm's date: no shift). */
export const formatCalendarDate = (value: string | null | undefined) => current.date(value);
/** Two calendar dates, both days included, the year always shown: "7–11 Dec 2026". */
export const formatDateRange = (first: string, last: string) => current.dateRange(first, last);
export const formatCount = (value: number) => current.count(value);
/** A small length in micrometres with one decimal: "4.2 µm" ("4,2 µm" in de-DE). */
export const formatUm = (value: number | null | undefined) => current.um(value);
/** A plain number with at most `digits` decimals, in the firm's locale. */
export const formatNumber = (value: number, digits = 1) => current.number(value, digits);
/** Integer minor units in a currency, in the firm's locale. */
export const formatMoney = (minor: number | null | undefined, currency: string) => formatMoneyIn(minor, currency, current.locale);

/** ISO timestamp for machine-readable `<time dateTime>` attributes and CSV. */
export function isoTimestamp(value: string | number | Date): string {
  const date = value instanceof Date ? value : new Date(value);
  return Number.isNaN(date.getTime()) ? String(value) : date.toISOString();
}

/** Money helpers live in shared/ so invoices and screens print amounts alike. */
export { currencyExponent as currencyDigits } from '../../shared/billing/money';

/** A file size people read: "840 KB", "2.4 MB". */
export const formatFileSize = (bytes: number) =>
  bytes >= 1024 * 1024 ? `${formatNumber(bytes / 1024 / 1024, 1)} MB` : `${formatNumber(Math.max(1, Math.round(bytes / 1024)), 0)} KB`;
