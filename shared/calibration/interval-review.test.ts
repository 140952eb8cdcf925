import { describe, expect, it } from 'vitest';
import { defaultIntervalPolicy, suggestInterval } from './interval-review';

// Method: OIML D 10 (2007) / ILAC-G24 "automatic adjustment or staircase" — extend the
// interval after in-tolerance results, reduce it after an out-of-tolerance one. The factors
// (×1.25 after two in a row, ×0.5 on out of tolerance, 3–36 months) are from memory of
// common use of the method, not values the documents prescribe.
describe('calibration interval review (OIML D 10 / ILAC-G24 staircase method)', () => {
  it('lengthens after two in-tolerance results in a row', () => {
    expect(suggestInterval(12, ['in_tolerance', 'in_tolerance'])).toMatchObject({ suggestedMonths: 15, change: 'lengthen' });
  });

  it('keeps the interval after a single in-tolerance result or an unreported one', () => {
    expect(suggestInterval(12, ['out_of_tolerance', 'in_tolerance'])).toMatchObject({ suggestedMonths: 12, change: 'keep' });
    expect(suggestInterval(12, ['in_tolerance', 'not_reported'])).toMatchObject({ suggestedMonths: 12, change: 'keep' });
  });

  it('halves the interval after an out-of-tolerance result', () => {
    expect(suggestInterval(12, ['in_tolerance', 'in_tolerance', 'out_of_tolerance'])).toMatchObject({ suggestedMonths: 6, change: 'shorten' });
  });

  it('stays within the limits', () => {
    expect(suggestInterval(36, ['in_tolerance', 'in_tolerance']).suggestedMonths).toBe(36);
    expect(suggestInterval(4, ['out_of_tolerance']).suggestedMonths).toBe(3);
    expect(suggestInterval(3, ['out_of_tolerance'])).toMatchObject({ suggestedMonths: 3, change: 'keep' });
  });

  it('follows the configured factors', () => {
    const policy = { ...defaultIntervalPolicy, lengthenAfter: 3, lengthenFactor: 1.5 };
    expect(suggestInterval(12, ['in_tolerance', 'in_tolerance'], policy).change).toBe('keep');
    expect(suggestInterval(12, ['in_tolerance', 'in_tolerance', 'in_tolerance'], policy).suggestedMonths).toBe(18);
  });
});
