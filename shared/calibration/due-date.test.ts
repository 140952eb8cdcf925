import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { NotACalendarDate } from '../dates/calendar-date';
import { addDays, calendarDayIn, calibrationState, dueDate, dueOnForPlan, todayIn } from './due-date';

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

describe('the calendar day of an instant in a time zone (independent of the process TZ)', () => {
  // Hand-written from the time-zone rules (from memory of the tz database): the United States
  // start daylight saving on the second Sunday of March at 02:00 (8 March 2026: PST −8 → PDT −7);
  // New Zealand ends it on the first Sunday of April at 03:00 (5 April 2026: NZDT +13 → NZST +12).
  it.each([
    ['2026-03-08T07:59:59.999Z', 'America/Los_Angeles', '2026-03-07'], // 23:59:59.999 PST on the 7th
    ['2026-03-08T08:00:00.000Z', 'America/Los_Angeles', '2026-03-08'], // midnight PST, the day the clocks go forward
    ['2026-03-09T06:59:59.999Z', 'America/Los_Angeles', '2026-03-08'], // 23:59:59.999 PDT: the 8th has 23 hours
    ['2026-03-09T07:00:00.000Z', 'America/Los_Angeles', '2026-03-09'],
    ['2026-04-04T10:59:59.999Z', 'Pacific/Auckland', '2026-04-04'], // 23:59:59.999 NZDT on the 4th
    ['2026-04-04T11:00:00.000Z', 'Pacific/Auckland', '2026-04-05'], // midnight NZDT
    ['2026-04-05T11:59:59.999Z', 'Pacific/Auckland', '2026-04-05'], // 23:59:59.999 NZST: the 5th has 25 hours
    ['2026-04-05T12:00:00.000Z', 'Pacific/Auckland', '2026-04-06'],
    ['2026-12-31T10:59:59.999Z', 'Pacific/Auckland', '2026-12-31'],
    ['2026-12-31T11:00:00.000Z', 'Pacific/Auckland', '2027-01-01'], // New Year in Auckland while it is still 31 December in UTC
    ['2026-06-30T18:29:59.999Z', 'Asia/Kolkata', '2026-06-30'], // IST +5:30, no daylight saving
    ['2026-06-30T18:30:00.000Z', 'Asia/Kolkata', '2026-07-01'],
  ])('%s in %s is %s (tz rules; Luxon agrees)', (iso, zone, day) => {
    const instant = new Date(iso);
    expect(calendarDayIn(instant, zone)).toBe(day);
    expect(DateTime.fromJSDate(instant, { zone }).toISODate()).toBe(day);
  });

  // Independent computation: Luxon's own zone arithmetic (DateTime.fromObject in a zone, startOf('day')).
  const zones = [
    'UTC',
    'America/Los_Angeles',
    'Pacific/Auckland',
    'Europe/Berlin',
    'America/St_Johns',
    'Pacific/Chatham',
    'Pacific/Kiritimati',
    'Pacific/Pago_Pago',
  ];
  it.each(zones)('agrees with Luxon one millisecond either side of every local midnight, 1 Mar – 15 Apr 2026 and 20 Sep – 10 Nov 2026, in %s', (zone) => {
    const wrong: string[] = [];
    for (const [from, to] of [
      ['2026-03-01', '2026-04-15'],
      ['2026-09-20', '2026-11-10'],
    ]) {
      for (let day = DateTime.fromISO(from, { zone }); day.toISODate()! <= to; day = day.plus({ days: 1 })) {
        const midnight = day.startOf('day');
        for (const ms of [-1, 0, 1]) {
          const instant = new Date(midnight.toMillis() + ms);
          const expected = DateTime.fromMillis(instant.getTime(), { zone }).toISODate();
          if (calendarDayIn(instant, zone) !== expected) wrong.push(`${instant.toISOString()} → ${calendarDayIn(instant, zone)}, Luxon ${expected}`);
        }
      }
    }
    expect(wrong).toEqual([]);
  });

  it('todayIn is the calendar day of now', () => {
    const instant = new Date('2026-04-05T11:30:00Z');
    expect(todayIn('Pacific/Auckland', instant)).toBe(calendarDayIn(instant, 'Pacific/Auckland'));
  });
});
