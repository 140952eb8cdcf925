/**
 * CSV downloads are read by programs (a spreadsheet's import, an accounting tool): their cells stay machine-readable
 * whatever the firm's locale (ISO 8601 dates, decimals with a point and no grouping, codes), and the heading says
 * the unit or currency in words. The firm's format is for what people read: screens, mail, PDFs, refusals.
 */
import { currencyExponent } from '../billing/money';

/** A column heading naming its unit: "Amount (EUR)", "Max deviation (µm)". */
export const columnHeading = (label: string, unit: string) => `${label} (${unit})`;

/**
 * Integer minor units as the plain decimal of the currency's ISO 4217 exponent, worked on the digits (no floating
 * point): 404600 EUR → "4046.00", -5 EUR → "-0.05", 1234 JPY → "1234", 1234 BHD → "1.234".
 */
export function plainAmount(minor: number, currency: string): string {
  const digits = currencyExponent(currency);
  const sign = minor < 0 ? '-' : '';
  const figures = String(Math.abs(Math.trunc(minor))).padStart(digits + 1, '0');
  return digits ? `${sign}${figures.slice(0, -digits)}.${figures.slice(-digits)}` : `${sign}${figures}`;
}
