import { describe, expect, it } from 'vitest';
import { currencyExponent, formatMoney } from './money';

// Expected minor units written by hand from ISO 4217 list one as published by the
// maintenance agency (list_one.xml, "Pblshd" 2024-06-25, column "CcyMnrUnts").
const iso4217MinorUnits: [string, number][] = [
  ['EUR', 2],
  ['JPY', 0],
  ['HUF', 2], // CLDR (Intl) displays 0 decimals
  ['IDR', 2], // CLDR: 0
  ['COP', 2], // CLDR: 0
  ['PKR', 2], // CLDR: 0
  ['ALL', 2], // CLDR: 0
  ['LBP', 2], // CLDR: 0
  ['IQD', 3], // CLDR: 0
  ['BHD', 3],
  ['KWD', 3],
  ['TND', 3],
  ['ISK', 0],
  ['CLP', 0],
  ['UGX', 0],
  ['MGA', 2],
  ['CLF', 4],
];

describe('currency minor units (ISO 4217, not CLDR display digits)', () => {
  it.each(iso4217MinorUnits)('%s has %i decimals in ISO 4217 list one', (code, digits) => {
    expect(currencyExponent(code)).toBe(digits);
  });

  it('differs from what Intl (CLDR) would display for the forint, rupiah and Iraqi dinar', () => {
    const cldr = (code: string) => new Intl.NumberFormat('en', { style: 'currency', currency: code }).resolvedOptions().maximumFractionDigits;
    expect([cldr('HUF'), cldr('IDR'), cldr('IQD')]).toEqual([0, 0, 0]);
    expect([currencyExponent('HUF'), currencyExponent('IDR'), currencyExponent('IQD')]).toEqual([2, 2, 3]);
  });

  it('refuses a code that is not in ISO 4217', () => {
    expect(() => currencyExponent('ZZZ')).toThrow(/ISO 4217/);
  });
});

// Intl puts a no-break space after a currency code; compare with plain spaces.
const text = (minor: number | null, code: string) => formatMoney(minor, code, 'en-US').replace(/\u00a0/g, ' ');

describe('money as text', () => {
  // Hand-written: 123 456 minor units with the ISO 4217 decimals above (arithmetic).
  it.each([
    ['HUF', 'HUF 1,234.56'], // not HUF 1,235: the stored value is in fillér
    ['IQD', 'IQD 123.456'],
    ['EUR', '€1,234.56'],
    ['JPY', '¥123,456'],
    ['KWD', 'KWD 123.456'],
    ['CLF', 'CLF 12.3456'],
  ])('123456 minor units of %s read %s', (code, expected) => {
    expect(text(123_456, code)).toBe(expected);
  });

  it('shows every decimal the currency has, even trailing zeros (a forint deposit of 50 000.00)', () => {
    expect(text(5_000_000, 'HUF')).toBe('HUF 50,000.00');
    expect(text(null, 'EUR')).toBe('—');
  });
});
