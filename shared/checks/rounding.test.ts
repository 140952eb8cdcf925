import { describe, expect, it } from 'vitest';
import { roundUm, tenthsOfUm } from './rounding';

// Independent reference: ICU's own half-even rounding of exact decimal strings,
// through Intl.NumberFormat's `roundingMode: 'halfEven'` (ECMA-402 NumberFormat v3).
// A string input is formatted as the exact decimal, so no binary noise enters the reference.
const icuHalfEven = new Intl.NumberFormat('en', { minimumFractionDigits: 1, maximumFractionDigits: 1, roundingMode: 'halfEven', useGrouping: false });
const reference = (decimal: string) => Number(icuHalfEven.format(decimal as unknown as number));

describe('rounding to 0.1 µm, half to even (ASTM E29 rounding method)', () => {
  // Worked cases of the half-even rule (from memory of ASTM E29: a 5 followed by nothing
  // rounds to the even neighbour), each checked against ICU below.
  it.each([
    [27.25, '27.25', 27.2], // 5 after an even digit: down
    [27.35, '27.35', 27.4], // 5 after an odd digit: up
    [27.45, '27.45', 27.4],
    [27.349, '27.349', 27.3], // below the half: down
    [27.251, '27.251', 27.3], // above the half: up
    [-27.25, '-27.25', -27.2], // symmetric about zero
    [0.05, '0.05', 0],
    [0.15, '0.15', 0.2],
  ])('%f µm → %s rounds to %f', (value, exact, expected) => {
    expect(reference(exact)).toBe(expected);
    expect(roundUm(value)).toBe(expected);
  });

  it('agrees with ICU on every half-way value from 0.05 to 999.95 µm, given as binary floats', () => {
    const disagreements: string[] = [];
    for (let k = 0; k < 10_000; k += 1) {
      const exact = `${Math.floor(k / 10)}.${k % 10}5`;
      if (roundUm(Number(exact)) !== reference(exact)) disagreements.push(exact);
    }
    expect(disagreements).toEqual([]);
  });

  it('sees through binary noise: 15 + 6 × 2.05 is 273 tenths, as is 27.3 (arithmetic)', () => {
    expect(15 + 6 * 2.05).not.toBe(27.3); // the floating-point sum is 27.299999999999997
    expect(tenthsOfUm(15 + 6 * 2.05)).toBe(273);
    expect(tenthsOfUm(27.3)).toBe(273);
    expect(tenthsOfUm(0.0273 * 1000)).toBe(273);
    expect(Object.is(roundUm(-0.04), 0)).toBe(true); // never −0 on a record
  });

  it('refuses what is not a number', () => {
    expect(() => tenthsOfUm(Number.NaN)).toThrow(/micrometres/);
  });
});
