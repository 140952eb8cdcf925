/** Money is integer minor units with an ISO 4217 code (DESIGN.md §5); Intl knows each currency's exponent. */

/** Digits after the decimal point for an ISO 4217 currency (EUR 2, JPY 0, BHD 3). */
export function currencyExponent(currency: string): number {
  try {
    return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

/** Integer minor units as money; `locale` undefined means the runtime's own (the browser's). */
export function formatMoney(minor: number | null | undefined, currency: string, locale?: string): string {
  if (minor === null || minor === undefined) return '—';
  const digits = currencyExponent(currency);
  try {
    return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(minor / 10 ** digits);
  } catch {
    return `${(minor / 10 ** digits).toFixed(digits)} ${currency}`;
  }
}
