import { addDays, eachDayOfInterval, formatISO, isAfter, parseISO } from 'date-fns';
import { describe, expect, it } from 'vitest';
import { overdueDays, type Coverage } from './overdue-days';

// Independent reference: walk every calendar day with date-fns (a general-purpose date library) and ask, for each
// day, which calibration was newest and whether the day lies after its due date. The rule itself is common practice
// (ISO/IEC 17025:2017 §6.4.7 asks for a calibration programme; counting days past due is the firm's own measure).
function byEveryDay(period: { from: string; to: string }, coverage: Coverage[]) {
  return eachDayOfInterval({ start: parseISO(period.from), end: parseISO(period.to) }).filter((day) => {
    const iso = formatISO(day, { representation: 'date' });
    const current = coverage.filter((c) => c.performedOn <= iso).sort((a, b) => b.performedOn.localeCompare(a.performedOn))[0];
    return current !== undefined && isAfter(day, parseISO(current.dueOn));
  }).length;
}

describe('overdue days in a period', () => {
  const year = { from: '2025-01-01', to: '2025-12-31' };

  it('counts nothing while every day is covered', () => {
    const coverage = [
      { performedOn: '2024-06-01', dueOn: '2025-06-01' },
      { performedOn: '2025-05-20', dueOn: '2026-05-20' },
    ];
    expect(overdueDays(year, coverage)).toBe(0);
    expect(byEveryDay(year, coverage)).toBe(0);
  });

  it('counts the days between a lapsed due date and the next calibration (31 days in March, from memory of the calendar)', () => {
    const coverage = [
      { performedOn: '2024-02-28', dueOn: '2025-02-28' },
      { performedOn: '2025-04-01', dueOn: '2026-04-01' },
    ];
    expect(overdueDays(year, coverage)).toBe(31);
    expect(overdueDays(year, coverage)).toBe(byEveryDay(year, coverage));
  });

  it('counts to the end of the period when no calibration followed, and not before the first one on record', () => {
    const coverage = [{ performedOn: '2025-03-10', dueOn: '2025-09-10' }];
    expect(overdueDays(year, coverage)).toBe(byEveryDay(year, coverage));
    expect(overdueDays(year, coverage)).toBe(112);
    expect(overdueDays(year, [])).toBe(0);
  });

  it('agrees with the day-by-day walk over many generated histories, leap years included', () => {
    let seed = 7;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    for (let n = 0; n < 200; n += 1) {
      const start = addDays(parseISO('2023-01-01'), Math.floor(next() * 700));
      const coverage = Array.from({ length: Math.floor(next() * 4) }, () => {
        const performed = addDays(start, Math.floor(next() * 500) - 200);
        return {
          performedOn: formatISO(performed, { representation: 'date' }),
          dueOn: formatISO(addDays(performed, Math.floor(next() * 400)), { representation: 'date' }),
        };
      });
      const period = {
        from: formatISO(start, { representation: 'date' }),
        to: formatISO(addDays(start, Math.floor(next() * 400)), { representation: 'date' }),
      };
      expect(overdueDays(period, coverage)).toBe(byEveryDay(period, coverage));
    }
  });
});
