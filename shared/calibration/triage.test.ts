import { describe, expect, it } from 'vitest';
import { triage } from './triage';

const fixed = (um: number, note = 'bore position') => ({ tolerance: { kind: 'fixed' as const, um }, distanceM: null, note });

// Boundary arithmetic by hand: 25 µm ÷ 4 = 6.25 µm, stated to 0.1 µm half to even (ASTM E29 rounding method) is 6.2 µm.
// The 4:1 ratio is common practice.
describe('impact triage of one booking', () => {
  it.each([
    [6.2, 'no_effect_likely'], // exactly the allowance
    [6.25, 'no_effect_likely'], // rounds half to even to 6.2
    [6.3, 'remeasure_advised'],
    [-6.2, 'no_effect_likely'], // the size of the error counts, not its sign
  ])('an as-found error of %f µm against ±25 µm at 4:1 → %s', (errorUm, suggestion) => {
    const t = triage({ asFoundErrorUm: errorUm, errorSource: 'certificate', job: fixed(25), ratio: 4 });
    expect(t).toMatchObject({ suggestion, toleranceUm: 25, allowanceUm: 6.2, ratio: 4 });
  });

  it('evaluates an A + B·L tolerance at the job distance', () => {
    // 10 µm + 5 µm/m × 3.5 m = 27.5 µm; ÷ 4 = 6.875 → 6.9 µm (by hand).
    const job = { tolerance: { kind: 'range' as const, aUm: 10, bUmPerM: 5 }, distanceM: 3.5, note: 'flange flatness' };
    expect(triage({ asFoundErrorUm: 6.9, errorSource: 'check', job, ratio: 4 })).toMatchObject({
      suggestion: 'no_effect_likely',
      toleranceUm: 27.5,
      allowanceUm: 6.9,
    });
    expect(triage({ asFoundErrorUm: 7, errorSource: 'check', job, ratio: 4 }).suggestion).toBe('remeasure_advised');
  });

  it('follows the firm ratio', () => {
    // 25 ÷ 10 = 2.5 µm.
    expect(triage({ asFoundErrorUm: 3, errorSource: 'certificate', job: fixed(25), ratio: 10 }).suggestion).toBe('remeasure_advised');
    expect(triage({ asFoundErrorUm: 2.5, errorSource: 'certificate', job: fixed(25), ratio: 10 }).suggestion).toBe('no_effect_likely');
  });

  it('cannot judge without a tolerance, a distance for A + B·L, or an as-found value', () => {
    expect(triage({ asFoundErrorUm: 3, errorSource: 'certificate', job: null, ratio: 4 })).toMatchObject({ suggestion: 'cannot_judge', toleranceUm: null });
    expect(
      triage({
        asFoundErrorUm: 3,
        errorSource: 'certificate',
        job: { tolerance: { kind: 'range', aUm: 10, bUmPerM: 5 }, distanceM: null, note: null },
        ratio: 4,
      }).suggestion,
    ).toBe('cannot_judge');
    expect(triage({ asFoundErrorUm: null, errorSource: null, job: fixed(25), ratio: 4 })).toMatchObject({ suggestion: 'cannot_judge', asFoundErrorUm: null });
  });
});
