import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { assertCalendarDate, calendarDateProblem, FIRST_YEAR, isCalendarDate, LAST_YEAR, NotACalendarDate } from './calendar-date';

const pad = (n: number, width = 2) => String(n).padStart(width, '0');
/** The independent judge: luxon (not used by the code under test) parsing the same text in UTC. */
const luxonSaysReal = (s: string) => DateTime.fromFormat(s, 'yyyy-MM-dd', { zone: 'utc' }).isValid;

describe('calendar dates', () => {
  it('agrees with luxon on every month and day (00–32, months 00–13) of leap, common and century years', () => {
    for (const year of [1900, 1999, 2000, 2023, 2024, 2026, 2028, 2100, 2199]) {
      for (let month = 0; month <= 13; month++) {
        for (let day = 0; day <= 32; day++) {
          const s = `${year}-${pad(month)}-${pad(day)}`;
          expect(isCalendarDate(s), s).toBe(luxonSaysReal(s));
        }
      }
    }
  });

  it('agrees with luxon on 29 February of every year in range', () => {
    for (let year = FIRST_YEAR; year <= LAST_YEAR; year++) {
      const s = `${year}-02-29`;
      expect(isCalendarDate(s), s).toBe(luxonSaysReal(s));
    }
  });

  it('follows the Gregorian leap-year rule on the textbook cases', () => {
    // Gregorian rule (every 4th year; centuries only when divisible by 400) — from memory, confirmed by luxon above.
    expect(isCalendarDate('2024-02-29')).toBe(true);
    expect(isCalendarDate('2000-02-29')).toBe(true);
    expect(isCalendarDate('2026-02-29')).toBe(false);
    expect(isCalendarDate('1900-02-29')).toBe(false);
    expect(isCalendarDate('2100-02-29')).toBe(false);
    expect(isCalendarDate('2026-02-30')).toBe(false);
    expect(isCalendarDate('2026-04-31')).toBe(false);
  });

  it('refuses years outside the product range even where the calendar has them', () => {
    for (const s of ['0000-01-01', '0001-01-01', '1899-12-31', '2200-01-01', '9999-12-31']) {
      expect(isCalendarDate(s), s).toBe(false);
      expect(calendarDateProblem(s)).toBe(`must be a date between ${FIRST_YEAR} and ${LAST_YEAR}`);
    }
    expect(isCalendarDate(`${FIRST_YEAR}-01-01`)).toBe(true);
    expect(isCalendarDate(`${LAST_YEAR}-12-31`)).toBe(true);
  });

  it('accepts only the YYYY-MM-DD shape', () => {
    for (const s of ['2026-2-3', '20260203', ' 2026-02-03', '2026-02-03 ', '2026-02-03T00:00:00Z', '2026/02/03', '２０２６-02-03', '2026-02-0\u0000', '']) {
      expect(calendarDateProblem(s), JSON.stringify(s)).toBe('must be a date YYYY-MM-DD');
    }
  });

  it('assertCalendarDate returns a real date and throws NotACalendarDate (a RangeError) naming the problem otherwise', () => {
    expect(assertCalendarDate('2028-02-29')).toBe('2028-02-29');
    expect(() => assertCalendarDate('2026-02-30')).toThrow(NotACalendarDate);
    expect(() => assertCalendarDate('2026-13-01')).toThrow('"2026-13-01" is not a date: the month must be 01 to 12.');
    expect(new NotACalendarDate('x')).toBeInstanceOf(RangeError);
  });
});
