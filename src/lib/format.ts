import { createContext, useContext, useMemo } from 'react';

/**
 * Dates and times are shown in the organization's time zone (DESIGN.md §5).
 * The shell provides it from the signed-in session; formatting is Intl only.
 */
export const TimeZoneContext = createContext<string | undefined>(undefined);

const locale = undefined; // the browser's own locale

function toDate(value: string | number | Date): Date {
  return value instanceof Date ? value : new Date(value);
}

export function formatDateTime(value: string | number | Date | null | undefined, timeZone?: string): string {
  if (value === null || value === undefined || value === '') return '—';
  const date = toDate(value);
  if (Number.isNaN(date.getTime())) return String(value);
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short', timeZone }).format(date);
}

export function formatDate(value: string | number | Date | null | undefined, timeZone?: string): string {
  if (value === null || value === undefined || value === '') return '—';
  const date = toDate(value);
  if (Number.isNaN(date.getTime())) return String(value);
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeZone }).format(date);
}

/** ISO timestamp for machine-readable `<time dateTime>` attributes and CSV. */
export function isoTimestamp(value: string | number | Date): string {
  const date = toDate(value);
  return Number.isNaN(date.getTime()) ? String(value) : date.toISOString();
}

export function formatCount(value: number): string {
  return new Intl.NumberFormat(locale).format(value);
}

/** Formatters bound to the organization's time zone. */
export function useDateFormat() {
  const timeZone = useContext(TimeZoneContext);
  return useMemo(
    () => ({
      timeZone,
      dateTime: (value: string | number | Date | null | undefined) => formatDateTime(value, timeZone),
      date: (value: string | number | Date | null | undefined) => formatDate(value, timeZone),
    }),
    [timeZone],
  );
}

/** Money helpers live in shared/ so invoices and screens print amounts alike. */
export { currencyExponent as currencyDigits, formatMoney } from '../../shared/billing/money';

/** A plain number with at most `digits` decimals, in the browser's locale. */
export function formatNumber(value: number, digits = 1): string {
  return new Intl.NumberFormat(locale, { maximumFractionDigits: digits }).format(value);
}

/** A calendar date `YYYY-MM-DD` (no time zone shift: it already is the organization's date). */
export function formatCalendarDate(value: string | null | undefined): string {
  if (!value) return '—';
  const [y, m, d] = value.split('-').map(Number);
  if (!y || !m || !d) return value;
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeZone: 'UTC' }).format(new Date(Date.UTC(y, m - 1, d)));
}

/** A file size people read: "840 KB", "2.4 MB". */
export const formatFileSize = (bytes: number) =>
  bytes >= 1024 * 1024 ? `${formatNumber(bytes / 1024 / 1024, 1)} MB` : `${formatNumber(Math.max(1, Math.round(bytes / 1024)), 0)} KB`;
