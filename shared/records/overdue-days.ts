/** A calibration as it covers the days after it: performed on one day, valid through its due date. */
export type Coverage = { performedOn: string; dueOn: string };

const DAY_MS = 86_400_000;
const dayNumber = (isoDate: string) => Date.UTC(+isoDate.slice(0, 4), +isoDate.slice(5, 7) - 1, +isoDate.slice(8, 10)) / DAY_MS;

/**
 * How many days of the period (both ends included) the item was used past its due date: on each day the newest
 * calibration performed on or before it sets the due date, and a day after that due date is overdue. Days before
 * the first calibration on record are not counted (the record cannot say whether the item was in service).
 */
export function overdueDays(period: { from: string; to: string }, coverage: readonly Coverage[]): number {
  const from = dayNumber(period.from);
  const to = dayNumber(period.to);
  const sorted = [...coverage].sort((a, b) => (a.performedOn < b.performedOn ? -1 : a.performedOn > b.performedOn ? 1 : 0));
  let total = 0;
  sorted.forEach((c, i) => {
    const segmentEnd = i + 1 < sorted.length ? dayNumber(sorted[i + 1].performedOn) - 1 : Infinity;
    const first = Math.max(dayNumber(c.dueOn) + 1, dayNumber(c.performedOn), from);
    const last = Math.min(segmentEnd, to);
    if (last >= first) total += last - first + 1;
  });
  return total;
}
