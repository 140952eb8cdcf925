import { describe, expect, it } from 'vitest';
import { defaultIntervalPolicy, suggestInterval, type AsFound, type IntervalPolicy } from './interval-review';

// Method: OIML D 10 (2007) / ILAC-G24 "automatic adjustment or staircase" — extend the
// interval after in-tolerance results, reduce it after an out-of-tolerance one (method 1;
// from memory). The factors (×1.25 after two in a row, ×0.5 on out of tolerance, 3–36 months)
// are from memory of common use of the method, not values the documents prescribe.
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

  it('stays within the limits, and says so when a limit stops a move', () => {
    expect(suggestInterval(36, ['in_tolerance', 'in_tolerance'])).toMatchObject({
      suggestedMonths: 36,
      change: 'keep',
      reason: expect.stringMatching(/maximum of 36 months/),
    });
    expect(suggestInterval(32, ['in_tolerance', 'in_tolerance'])).toMatchObject({ suggestedMonths: 36, change: 'lengthen' });
    expect(suggestInterval(4, ['out_of_tolerance'])).toMatchObject({ suggestedMonths: 3, change: 'shorten' });
    expect(suggestInterval(3, ['out_of_tolerance'])).toMatchObject({
      suggestedMonths: 3,
      change: 'keep',
      reason: expect.stringMatching(/minimum of 3 months/),
    });
  });

  it('follows the configured factors', () => {
    const policy = { ...defaultIntervalPolicy, lengthenAfter: 3, lengthenFactor: 1.5 };
    expect(suggestInterval(12, ['in_tolerance', 'in_tolerance'], policy).change).toBe('keep');
    expect(suggestInterval(12, ['in_tolerance', 'in_tolerance', 'in_tolerance'], policy).suggestedMonths).toBe(18);
  });
});

describe('a suggestion never moves against the evidence (OIML D 10 method 1)', () => {
  it('does not offer "lengthen to 3 months" after an out-of-tolerance result on a 2-month interval: outside the policy', () => {
    const s = suggestInterval(2, ['in_tolerance', 'out_of_tolerance']);
    expect(s).toMatchObject({ suggestedMonths: 2, change: 'outside_policy', policyRange: { minMonths: 3, maxMonths: 36 } });
    expect(s.reason).toMatch(/out of tolerance.*2 months is below the policy's range of 3–36 months/i);
  });

  it('does not cut a 48-month interval to 36 after in-tolerance results, nor call that "keep": outside the policy', () => {
    const s = suggestInterval(48, ['in_tolerance', 'in_tolerance']);
    expect(s).toMatchObject({ suggestedMonths: 48, change: 'outside_policy', policyRange: { minMonths: 3, maxMonths: 36 } });
    expect(s.reason).toMatch(/48 months is above the policy's range of 3–36 months/);
    expect(suggestInterval(48, ['in_tolerance'])).toMatchObject({ suggestedMonths: 48, change: 'outside_policy' });
  });

  it('moves back into the range when the evidence points there', () => {
    expect(suggestInterval(48, ['out_of_tolerance'])).toMatchObject({ suggestedMonths: 24, change: 'shorten' });
    expect(suggestInterval(100, ['out_of_tolerance'])).toMatchObject({ suggestedMonths: 36, change: 'shorten' });
    expect(suggestInterval(2, ['in_tolerance', 'in_tolerance'])).toMatchObject({ suggestedMonths: 3, change: 'lengthen' });
    expect(suggestInterval(1, ['in_tolerance', 'in_tolerance'])).toMatchObject({ suggestedMonths: 3, change: 'lengthen' });
  });

  it('holds over every interval from 1 to 120 months, every policy range tried and every short history', () => {
    const results: AsFound[] = ['in_tolerance', 'out_of_tolerance', 'not_reported'];
    const histories: AsFound[][] = results.flatMap((a) => results.flatMap((b) => results.map((c) => [a, b, c])));
    const policies: IntervalPolicy[] = [
      defaultIntervalPolicy,
      { ...defaultIntervalPolicy, minMonths: 6, maxMonths: 24, shortenFactor: 0.75, lengthenFactor: 1.1 },
      { ...defaultIntervalPolicy, minMonths: 1, maxMonths: 60, shortenFactor: 1 },
    ];
    const wrong: string[] = [];
    for (const policy of policies) {
      for (let months = 1; months <= 120; months += 1) {
        for (const history of histories) {
          const s = suggestInterval(months, history, policy);
          const delta = s.suggestedMonths - months;
          const label = `${months} months after ${history.join(',')} (${policy.minMonths}–${policy.maxMonths}): ${s.change} to ${s.suggestedMonths}`;
          if (history[2] === 'out_of_tolerance' && delta > 0) wrong.push(label);
          if (history[2] !== 'out_of_tolerance' && delta < 0) wrong.push(label);
          if ((s.change === 'lengthen') !== delta > 0 || (s.change === 'shorten') !== delta < 0) wrong.push(`${label} (word and move disagree)`);
          const inRange = s.suggestedMonths >= policy.minMonths && s.suggestedMonths <= policy.maxMonths;
          if (s.change !== 'outside_policy' && !inRange) wrong.push(`${label} (outside the range, not reported so)`);
        }
      }
    }
    expect(wrong).toEqual([]);
  });
});
