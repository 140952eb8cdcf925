import { describe, expect, it } from 'vitest';
import { cheapestCover, depositMinor, lateChargeMinor, taxMinor } from './quote';

// Rates for the worked examples: day 100, week (7 days) 500, month (28 days) 1 600.
// Each expected value was worked out by hand (common practice: charge the cheapest
// combination of periods that covers the rental days).
const rates = { dayMinor: 100, weekMinor: 500, monthMinor: 1600 };

describe('rental price: the cheapest cover of whole days', () => {
  it.each([
    [1, { months: 0, weeks: 0, days: 1 }, 100], // one day
    [6, { months: 0, weeks: 1, days: 0 }, 500], // six days cost 600; a week covers them for 500
    [7, { months: 0, weeks: 1, days: 0 }, 500],
    [8, { months: 0, weeks: 1, days: 1 }, 600], // week + day 600 beats two weeks 1 000
    [13, { months: 0, weeks: 2, days: 0 }, 1000], // week + 6 days 1 100; two weeks 1 000
    [27, { months: 1, weeks: 0, days: 0 }, 1600], // four weeks 2 000; a month 1 600
    [28, { months: 1, weeks: 0, days: 0 }, 1600],
    [29, { months: 1, weeks: 0, days: 1 }, 1700],
    [60, { months: 2, weeks: 0, days: 4 }, 3600], // 2 months + 4 days 3 600; + a week 3 700; 3 months 4 800
  ])('%i days → %o for %i', (days, periods, total) => {
    expect(cheapestCover(days, rates)).toEqual({ periods, totalMinor: total });
  });

  it('refuses a rental of no days', () => {
    expect(() => cheapestCover(0, rates)).toThrow(/at least one/);
  });

  it('charges late days at the day rate plus the late fee', () => {
    expect(lateChargeMinor(3, rates, 50)).toBe(450);
    expect(lateChargeMinor(-1, rates, 50)).toBe(0);
  });

  it('rounds tax half up to the minor unit (19 % of 1 234 = 234.46 → 234; of 1 250 = 237.5 → 238)', () => {
    expect(taxMinor(1234, 1900)).toBe(234);
    expect(taxMinor(1250, 1900)).toBe(238);
  });

  it('holds the deposit between its minimum and maximum', () => {
    const policy = { percent: 10, minMinor: 50_000, maxMinor: 500_000 };
    expect(depositMinor(1_000_000, policy)).toBe(100_000);
    expect(depositMinor(100_000, policy)).toBe(50_000);
    expect(depositMinor(99_000_000, policy)).toBe(500_000);
  });
});
