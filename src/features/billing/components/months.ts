import { addMonths, format, lastDayOfMonth, parseISO } from 'date-fns';

const first = (month: string) => parseISO(`${month}-01`);

/** A month YYYY-MM moved by `n` months. */
export const shiftMonth = (month: string, n: number) => format(addMonths(first(month), n), 'yyyy-MM');

/** Every month from `from` to `to`, both included (none when `to` is before `from`). */
export function monthsBetween(from: string, to: string): string[] {
  const months: string[] = [];
  for (let m = from; m <= to && months.length < 120; m = shiftMonth(m, 1)) months.push(m);
  return months;
}

/** "March 2025" in a heading. */
export const monthLong = (month: string) => format(first(month), 'MMMM yyyy');

/** The first and the last day of a month range, for reports that take dates. */
export const monthRangeDates = (from: string, to: string) => ({ from: `${from}-01`, to: format(lastDayOfMonth(first(to)), 'yyyy-MM-dd') });
