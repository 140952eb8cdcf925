import { addMonths, differenceInCalendarDays, format, parseISO } from 'date-fns';
import { assertCalendarDate } from '../dates/calendar-date';

/** DESIGN.md §5 "Due date". Dates are calendar dates (`YYYY-MM-DD`) in the organization's time zone. */
export type CalibrationState = 'current' | 'due_soon' | 'overdue' | 'not_required';
export const calibrationStates: readonly CalibrationState[] = ['current', 'due_soon', 'overdue', 'not_required'];
export const DEFAULT_DUE_SOON_DAYS = 30;

export type CalibrationPlan = { required: boolean; intervalMonths: number | null; lastCalibratedOn: string | null };

/** Last calibration + interval in calendar months; a day past the month's end
 * clamps to its last day (31 Jan + 1 month = 28/29 Feb) — date-fns addMonths does exactly that.
 * Throws `NotACalendarDate` for a date that does not exist (the API answers 400). */
export function dueDate(lastCalibratedOn: string, intervalMonths: number): string {
  return format(addMonths(parseISO(assertCalendarDate(lastCalibratedOn)), intervalMonths), 'yyyy-MM-dd');
}

/** The plan's due date, or null when not required or never calibrated. */
export function dueOnForPlan(plan: CalibrationPlan): string | null {
  if (!plan.required || !plan.lastCalibratedOn || !plan.intervalMonths) return null;
  return dueDate(plan.lastCalibratedOn, plan.intervalMonths);
}

/**
 * An item is valid through its due date: overdue only once today is after it.
 * A required item with no calibration on record counts as overdue — nothing
 * shows it is fit for use.
 */
export function calibrationState(required: boolean, dueOn: string | null, today: string, dueSoonDays = DEFAULT_DUE_SOON_DAYS): CalibrationState {
  if (!required) return 'not_required';
  if (!dueOn) return 'overdue';
  const daysLeft = differenceInCalendarDays(parseISO(dueOn), parseISO(today));
  if (daysLeft < 0) return 'overdue';
  return daysLeft <= dueSoonDays ? 'due_soon' : 'current';
}

// Building an Intl formatter is far costlier than using one; keep one per zone.
const dayFormatters = new Map<string, Intl.DateTimeFormat>();

/**
 * The calendar day (`YYYY-MM-DD`) an instant falls on in an IANA time zone —
 * the firm's day, wherever the server or browser runs. Read field by field with
 * formatToParts (Gregorian calendar, Latin digits), not from a locale's layout.
 */
export function calendarDayIn(instant: Date, timeZone: string): string {
  let formatter = dayFormatters.get(timeZone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-US', { timeZone, calendar: 'gregory', numberingSystem: 'latn', year: 'numeric', month: '2-digit', day: '2-digit' });
    dayFormatters.set(timeZone, formatter);
  }
  const parts = formatter.formatToParts(instant);
  const field = (type: 'year' | 'month' | 'day') => parts.find((p) => p.type === type)!.value;
  return `${field('year').padStart(4, '0')}-${field('month')}-${field('day')}`;
}

/** Today's calendar date in an IANA time zone. */
export const todayIn = (timeZone: string, now: Date = new Date()): string => calendarDayIn(now, timeZone);

/** The date `days` after `date` (negative for before); `NotACalendarDate` for a date that does not exist. */
export function addDays(date: string, days: number): string {
  const d = parseISO(assertCalendarDate(date));
  d.setDate(d.getDate() + days);
  return format(d, 'yyyy-MM-dd');
}
