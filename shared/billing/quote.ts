/**
 * Rental prices (DESIGN.md §5): whole rental days, dates inclusive; day, week
 * (7 days) and month (28 days) rates; the cheapest combination of periods that
 * covers the days (a week may be cheaper than six single days); late days at
 * the day rate plus a late fee; tax from the firm's settings. Money is integer
 * minor units.
 */
export type Rates = { dayMinor: number; weekMinor: number; monthMinor: number };
export type Periods = { months: number; weeks: number; days: number };

export const WEEK_DAYS = 7;
export const MONTH_DAYS = 28;

/** The cheapest months/weeks/days that cover at least `days` days (dynamic programming over the day count). */
export function cheapestCover(days: number, rates: Rates): { periods: Periods; totalMinor: number } {
  if (!Number.isInteger(days) || days < 1) throw new Error('A rental lasts at least one whole day.');
  const cost = new Array<number>(days + 1).fill(0);
  const choice = new Array<keyof Periods>(days + 1).fill('days');
  for (let i = 1; i <= days; i += 1) {
    const options: [keyof Periods, number][] = [
      ['days', rates.dayMinor + cost[i - 1]],
      ['weeks', rates.weekMinor + cost[Math.max(0, i - WEEK_DAYS)]],
      ['months', rates.monthMinor + cost[Math.max(0, i - MONTH_DAYS)]],
    ];
    // Ties go to the longer period: fewer lines on the invoice for the same money.
    const [kind, value] = options.reduce((best, o) => (o[1] <= best[1] ? o : best));
    cost[i] = value;
    choice[i] = kind;
  }
  const periods: Periods = { months: 0, weeks: 0, days: 0 };
  for (let i = days; i > 0;) {
    const kind = choice[i];
    periods[kind] += 1;
    i = Math.max(0, i - (kind === 'days' ? 1 : kind === 'weeks' ? WEEK_DAYS : MONTH_DAYS));
  }
  return { periods, totalMinor: cost[days] };
}

/** Tax on a net amount, rounded half up to the minor unit; the rate in basis points (1 900 = 19 %). */
export const taxMinor = (netMinor: number, rateBasisPoints: number) => Math.floor((netMinor * rateBasisPoints) / 10_000 + 0.5);

/** Late days: each at the day rate plus the late fee. */
export const lateChargeMinor = (lateDays: number, rates: Rates, lateFeePerDayMinor: number) => Math.max(0, lateDays) * (rates.dayMinor + lateFeePerDayMinor);

/** Deposit: a share of the booked items' replacement value, held between a minimum and a maximum. */
export function depositMinor(replacementValueMinor: number, policy: { percent: number; minMinor: number; maxMinor: number }) {
  const share = Math.round((replacementValueMinor * policy.percent) / 100);
  return Math.min(policy.maxMinor, Math.max(policy.minMinor, share));
}

/** { months: 1, weeks: 0, days: 2 } → "1 month, 2 days" (a month is 28 days, a week 7). */
export const periodWords = (p: Periods) =>
  (['months', 'weeks', 'days'] as const)
    .filter((k) => p[k] > 0)
    .map((k) => `${p[k]} ${p[k] === 1 ? k.slice(0, -1) : k}`)
    .join(', ');
