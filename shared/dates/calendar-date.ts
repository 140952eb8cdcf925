/**
 * Calendar dates as the API carries them (`YYYY-MM-DD`, API.md "Conventions"),
 * checked strictly: `Date.parse` rolls 30 February over to 2 March, and
 * PostgreSQL then refuses what JavaScript let through.
 *
 * Years are limited to a range a fleet's records can plausibly need: it
 * catches a mistyped year (0226, 9026) and keeps dates computed from these
 * (a 120-month interval, a 400-day booking) inside every date type we use.
 */
export const FIRST_YEAR = 1900;
export const LAST_YEAR = 2199;

const SHAPE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Gregorian rule: every 4th year, except centuries not divisible by 400. */
const isLeapYear = (year: number) => (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** What is wrong with `value` as a calendar date, or null when it is one. */
export function calendarDateProblem(value: string): string | null {
  const parts = SHAPE.exec(value);
  if (!parts) return 'must be a date YYYY-MM-DD';
  const [year, month, day] = [Number(parts[1]), Number(parts[2]), Number(parts[3])];
  if (year < FIRST_YEAR || year > LAST_YEAR) return `must be a date between ${FIRST_YEAR} and ${LAST_YEAR}`;
  if (month < 1 || month > 12) return 'is not a date: the month must be 01 to 12';
  const last = month === 2 && isLeapYear(year) ? 29 : DAYS_IN_MONTH[month - 1];
  if (day < 1 || day > last) return `is not a date: that month has ${last} days`;
  return null;
}

export const isCalendarDate = (value: string) => calendarDateProblem(value) === null;

/** Thrown by date computations handed something that is not a calendar date. */
export class NotACalendarDate extends RangeError {
  constructor(readonly value: string) {
    super(`"${value.slice(0, 40)}" ${calendarDateProblem(value) ?? 'is not a calendar date'}.`);
  }
}

/** `value` itself when it is a calendar date; else throws `NotACalendarDate`. */
export function assertCalendarDate(value: string): string {
  if (!isCalendarDate(value)) throw new NotACalendarDate(value);
  return value;
}
