import { describe, expect, it } from 'vitest';
import { fromProviderAmount, providerAmountRule, providerStepMinor, roundUpToProviderStep, toProviderAmount } from './provider-amounts';

// The provider's published rules, docs.stripe.com/currencies (read for this change):
// "Zero-decimal currencies": BIF CLP DJF GNF JPY KMF KRW MGA PYG RWF UGX VND VUV XAF XOF XPF — the
//   amount is the charge ("to charge ¥500, provide an amount value of 500");
// "Three-decimal currencies": BHD JOD KWD OMR TND — the last digit must be 0 ("5.124 KWD must be rounded
//   to 5120 or 5130");
// "Special cases": ISK — "to charge 5 ISK, provide an amount value of 500", evenly divisible by 100
//   (support.stripe.com "Deprecation of fractional ISK charges and refunds"); HUF and TWD are zero-decimal
//   for payouts only and are charged with two decimals.
// ISO 4217 exponents are those of list one (see money.test.ts).
describe("amounts in the payment provider's units", () => {
  it.each([
    // [currency, ISO minor units, provider amount, what it is]
    ['EUR', 1_000, 1_000, '10.00 EUR: two decimals both sides'],
    ['JPY', 500, 500, '¥500: zero-decimal both sides (the docs’ own example)'],
    ['KRW', 10_000, 10_000, '₩10 000'],
    ['UGX', 50_000, 50_000, 'USh 50 000: zero-decimal in ISO 4217 and for the provider'],
    ['MGA', 1_250_000, 12_500, 'Ar 12 500.00: two decimals in ISO 4217, zero-decimal for the provider'],
    ['ISK', 5, 500, '5 ISK: zero decimals in ISO 4217, sent with two (the docs’ example)'],
    ['KWD', 5_120, 5_120, '5.120 KWD: three decimals, last digit 0'],
    ['BHD', 12_340, 12_340, '12.340 BHD'],
    ['HUF', 500_050, 500_050, 'HUF 5 000.50: charged with two decimals'],
    ['TWD', 12_345, 12_345, 'NT$123.45: charged with two decimals'],
    ['IQD', 12_340, 1_234, 'IQD 12.340: three decimals in ISO 4217, two at the provider'],
  ])('%s: %i minor units → amount %i (%s)', (currency, minor, amount) => {
    expect(toProviderAmount(minor, currency)).toBe(amount);
    expect(fromProviderAmount(amount, currency)).toBe(minor);
  });

  it('takes lower-case codes as the provider writes them', () => {
    expect(toProviderAmount(5, 'isk')).toBe(500);
    expect(fromProviderAmount(500, 'isk')).toBe(5);
  });

  it.each([
    ['KWD', 5_124, 10, 5_130], // "5.124 KWD must be rounded to 5120 or 5130": a deposit goes up
    ['TND', 1, 10, 10],
    ['MGA', 1_250_050, 100, 1_250_100], // no fraction of an ariary at the provider
    ['IQD', 12_345, 10, 12_350],
    ['ISK', 7, 1, 7],
    ['EUR', 1_234, 1, 1_234],
    ['JPY', 1_234, 1, 1_234],
  ])('%s %i minor units: the provider takes steps of %i, so a deposit becomes %i', (currency, minor, step, rounded) => {
    expect(providerStepMinor(currency)).toBe(step);
    expect(roundUpToProviderStep(minor, currency)).toBe(rounded);
  });

  it('refuses an amount the provider would not take rather than altering it', () => {
    expect(() => toProviderAmount(5_124, 'KWD')).toThrow(/multiples of 10/);
    expect(() => toProviderAmount(1_250_050, 'MGA')).toThrow(/multiples of 100/);
    expect(() => toProviderAmount(10.5, 'EUR')).toThrow(/whole number/);
  });
});

describe("the provider's published currency lists", () => {
  // Copied by hand from docs.stripe.com/currencies, "Zero-decimal currencies" and "Three-decimal currencies".
  it.each(['BIF', 'CLP', 'DJF', 'GNF', 'JPY', 'KMF', 'KRW', 'MGA', 'PYG', 'RWF', 'UGX', 'VND', 'VUV', 'XAF', 'XOF', 'XPF'])(
    '%s is zero-decimal: the amount is whole units',
    (code) => {
      expect(providerAmountRule(code)).toEqual({ digits: 0, step: 1 });
    },
  );
  it.each(['BHD', 'JOD', 'KWD', 'OMR', 'TND'])('%s is three-decimal with a last digit of 0', (code) => {
    expect(providerAmountRule(code)).toEqual({ digits: 3, step: 10 });
  });
  it.each(['EUR', 'USD', 'GBP', 'HUF', 'TWD', 'IDR', 'COP'])('%s is sent with two decimals', (code) => {
    expect(providerAmountRule(code)).toEqual({ digits: 2, step: 1 });
  });
});
