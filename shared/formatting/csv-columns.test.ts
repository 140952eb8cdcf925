import { describe, expect, it } from 'vitest';
import { columnHeading, plainAmount } from './csv-columns';

describe('CSV columns', () => {
  it('name the unit in the heading', () => {
    expect(columnHeading('Amount', 'EUR')).toBe('Amount (EUR)');
    expect(columnHeading('Max deviation', 'µm')).toBe('Max deviation (µm)');
  });

  // Exponents from the ISO 4217 list (EUR 2, JPY 0, BHD 3); the decimals worked by hand.
  it.each([
    [404_600, 'EUR', '4046.00'],
    [-1_000, 'EUR', '-10.00'],
    [5, 'EUR', '0.05'],
    [-5, 'EUR', '-0.05'],
    [0, 'EUR', '0.00'],
    [123_456_789_012, 'EUR', '1234567890.12'],
    [1_234, 'JPY', '1234'],
    [-1_234, 'JPY', '-1234'],
    [1_234, 'BHD', '1.234'],
    [7, 'BHD', '0.007'],
  ])('writes %i minor units of %s as %s: a point, no grouping, every decimal', (minor, currency, expected) => {
    expect(plainAmount(minor, currency)).toBe(expected);
  });

  it('refuses a currency that is not in ISO 4217', () => {
    expect(() => plainAmount(100, 'XXY')).toThrow(RangeError);
  });
});
