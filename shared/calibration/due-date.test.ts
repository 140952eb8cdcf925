import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { NotACalendarDate } from '../dates/calendar-date';
import { addDays, calibrationState, dueDate, dueOnForPlan, todayIn } from './due-date';

// Independent reference: Luxon's DateTime.plus({ months }), which also clamps to
// the month's last day (Luxon docs, "Math": "adding a month to Jan 31 gives Feb 28/29").
const luxonDue = (last: string, months: number) => DateTime.fromISO(last, { zone: 'utc' }).plus({ months }).toISODate();

describe('calibration due date (DESIGN.md §5)', () => {
  it.each([
    ['2026-01-31', 1, '2026-02-28'], // month-end clamp, common year
    ['2028-01-31', 1, '2028-02-29'], // leap year (2028 is divisible by 4; Gregorian rule)
    ['2026-08-31', 6, '2027-02-28'],
    ['2026-03-31', 1, '2026-04-30'],
    ['2026-05-15', 12, '2027-05-15'],
    ['2027-02-28', 12, '2028-02-28'],
    ['2028-02-29', 12, '2029-02-28'],
    ['2026-10-25', 24, '2028-10-25'], // across a DST change in Europe
  ])('%s + %i months = %s, as Luxon computes it', (last, months, expected) => {
    expect(dueDate(last, months)).toBe(expected);
    expect(dueDate(last, months)).toBe(luxonDue(last, months));
  });

  it('agrees with Luxon on every day of 2026–2028 for 1, 3, 6, 12 and 24 months', () => {
    let mismatches = 0;
    for (let d = DateTime.fromISO('2026-01-01', { zone: 'utc' }); d.year < 2029; d = d.plus({ days: 1 })) {
      for (const m of [1, 3, 6, 12, 24]) if (dueDate(d.toISODate()!, m) !== luxonDue(d.toISODate()!, m)) mismatches += 1;
    }
    expect(mismatches).toBe(0);
  });

  it('refuses dates that do not exist (and years outside 1900–2199) with NotACalendarDate, not date-fns\' "Invalid time value"', () => {
    const missing = ['2026-02-30', '2026-02-29', '2026-13-01', '2026-00-10'];
    // Luxon, the independent reference, finds no such days either.
    for (const d of missing) expect(DateTime.fromFormat(d, 'yyyy-MM-dd', { zone: 'utc' }).isValid, d).toBe(false);
    for (const d of [...missing, '0000-01-01']) {
      expect(() => dueDate(d, 12), d).toThrow(NotACalendarDate);
      expect(() => dueOnForPlan({ required: true, intervalMonths: 12, lastCalibratedOn: d }), d).toThrow(NotACalendarDate);
      expect(() => addDays(d, 1), d).toThrow(NotACalendarDate);
    }
  });

  it('has no due date when calibration is not required or never recorded', () => {
    expect(dueOnForPlan({ required: false, intervalMonths: 12, lastCalibratedOn: '2026-01-01' })).toBeNull();
    expect(dueOnForPlan({ required: true, intervalMonths: 12, lastCalibratedOn: null })).toBeNull();
    expect(dueOnForPlan({ required: true, intervalMonths: 12, lastCalibratedOn: '2026-01-01' })).toBe('2027-01-01');
  });
});

describe('calibration state', () => {
  const due = '2026-12-31';
  it('is valid through the due date and overdue the day after', () => {
    expect(calibrationState(true, due, '2026-12-31')).toBe('due_soon');
    expect(calibrationState(true, due, '2027-01-01')).toBe('overdue');
  });
  it('is due soon within the window (30 days by default) and current before it', () => {
    expect(calibrationState(true, due, '2026-12-01')).toBe('due_soon'); // 30 days left
    expect(calibrationState(true, due, '2026-11-30')).toBe('current'); // 31 days left
    expect(calibrationState(true, due, '2026-11-30', 45)).toBe('due_soon');
  });
  it('treats a required item with no calibration on record as overdue, and others as not required', () => {
    expect(calibrationState(true, null, '2026-12-01')).toBe('overdue');
    expect(calibrationState(false, null, '2026-12-01')).toBe('not_required');
  });
});

describe("today in the organization's time zone", () => {
  // 2026-12-01T23:30Z is already 2 December in Berlin (UTC+1 in winter) and still 1 December in New York.
  const instant = new Date('2026-12-01T23:30:00Z');
  it.each([
    ['Europe/Berlin', '2026-12-02'],
    ['UTC', '2026-12-01'],
    ['America/New_York', '2026-12-01'],
    ['Pacific/Auckland', '2026-12-02'],
  ])('%s → %s (checked with Luxon setZone)', (zone, expected) => {
    expect(todayIn(zone, instant)).toBe(expected);
    expect(DateTime.fromJSDate(instant).setZone(zone).toISODate()).toBe(expected);
  });
  it('adds calendar days across month and year ends', () => {
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
    expect(addDays('2026-03-28', 2)).toBe(DateTime.fromISO('2026-03-28').plus({ days: 2 }).toISODate());
  });
});
