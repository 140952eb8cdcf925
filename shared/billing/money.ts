import { code as iso4217 } from 'currency-codes';

/**
 * Money is integer minor units with an ISO 4217 code (DESIGN.md §5). The
 * exponent comes from the ISO 4217 table (the `currency-codes` package), not
 * from Intl: CLDR's display digits differ for some currencies (HUF, IDR, COP,
 * PKR, ALL, LBP shown with 0 decimals, IQD with 0), which would misread stored
 * amounts by a factor of 100 or 1000.
 */

/** Digits after the decimal point for an ISO 4217 currency (EUR 2, JPY 0, BHD 3); an unknown code is an error. */
export function currencyExponent(currency: string): number {
  const entry = iso4217(currency);
  if (!entry) throw new RangeError(`${currency} is not an ISO 4217 currency code.`);
  return entry.digits;
}

/** Integer minor units as money, always with the currency's ISO 4217 decimals; `locale` undefined means the runtime's own (the browser's). */
export function formatMoney(minor: number | null | undefined, currency: string, locale?: string): string {
  if (minor === null || minor === undefined) return '—';
  try {
    const digits = currencyExponent(currency);
    return new Intl.NumberFormat(locale, { style: 'currency', currency, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(
      minor / 10 ** digits,
    );
  } catch {
    return `${minor} ${currency} (minor units)`;
  }
}
