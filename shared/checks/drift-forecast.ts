import { TheilSenRegression } from 'ml-regression-theil-sen';
import { calendarDayIn } from '../calibration/due-date';

/**
 * Tip drift forecast: the largest deviation of a tip's passing validations in
 * one mounting position, fitted against time with the Theil–Sen line (the
 * median of pairwise slopes: one odd reading does not swing it), and the day
 * that line reaches the acceptance limit (the tolerance, less the guard band
 * under guarded acceptance). It advises: a forecast never holds or releases anything.
 *
 * The interval is Sen's (1968) confidence interval on the slope, as
 * scipy.stats.theilslopes computes it (normal approximation, ties in x and y
 * counted), extrapolated from the fitted level at the latest validation: the
 * steeper bound gives the earliest day, the shallower the latest (none when
 * the shallower bound does not rise).
 */
export const MIN_VALIDATIONS_FOR_FORECAST = 4;
/** Two-sided 95 %: the standard normal quantile for 0.975 (standard normal tables; scipy.stats.norm.ppf(0.975)). */
const Z_95 = 1.959963984540054;
/** A crossing further than this is "no failure in sight": a straight line says little five years out (common practice caution). */
export const FORECAST_HORIZON_DAYS = 5 * 365;
const DAY_MS = 86_400_000;

export type DriftPoint = { performedAt: string; maxDeviationUm: number };

/** The fitted line, x in days since the first validation, y in µm. */
export type DriftFit = { firstAt: string; slopeUmPerDay: number; interceptUm: number; lowSlopeUmPerDay: number; highSlopeUmPerDay: number };

export type DriftForecast =
  | { state: 'not_enough_history'; validations: number }
  | { state: 'no_drift'; validations: number; limitUm: number; fit: DriftFit }
  | { state: 'past_limit'; validations: number; limitUm: number; fit: DriftFit; reachedOn: string | null }
  | { state: 'forecast'; validations: number; limitUm: number; fit: DriftFit; reachesOn: string; earliestOn: string; latestOn: string | null };

/** How many values repeat, per repeated value (Sen's tie correction). */
function tieGroups(values: number[]): number[] {
  const counts = new Map<number, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  return [...counts.values()].filter((k) => k > 1);
}

/** Sen (1968) eq. 2.6: the bounds of the slope's confidence interval among the sorted pairwise slopes. */
export function senSlopeInterval(x: number[], y: number[], z = Z_95): { low: number; high: number } {
  const slopes: number[] = [];
  for (let i = 0; i < x.length; i += 1) for (let j = 0; j < x.length; j += 1) if (x[i] > x[j]) slopes.push((y[i] - y[j]) / (x[i] - x[j]));
  slopes.sort((a, b) => a - b);
  const n = y.length;
  const tie = (k: number) => k * (k - 1) * (2 * k + 5);
  const variance = (tie(n) - tieGroups(x).reduce((s, k) => s + tie(k), 0) - tieGroups(y).reduce((s, k) => s + tie(k), 0)) / 18;
  const sigma = Math.sqrt(variance);
  // numpy.round is half to even; the indices are the same as scipy's.
  const roundHalfEven = (v: number) => (Math.abs(v % 1) === 0.5 ? 2 * Math.round(v / 2) : Math.round(v));
  const upper = Math.min(roundHalfEven((slopes.length + z * sigma) / 2), slopes.length - 1);
  const lower = Math.max(roundHalfEven((slopes.length - z * sigma) / 2) - 1, 0);
  return { low: slopes[lower], high: slopes[upper] };
}

/** The Theil–Sen line through the points (days since the first), from ml-regression-theil-sen, with Sen's interval. */
export function fitDrift(points: DriftPoint[]): DriftFit {
  const sorted = [...points].sort((a, b) => a.performedAt.localeCompare(b.performedAt));
  const t0 = Date.parse(sorted[0].performedAt);
  const x = sorted.map((p) => (Date.parse(p.performedAt) - t0) / DAY_MS);
  const y = sorted.map((p) => p.maxDeviationUm);
  const line = new TheilSenRegression(x, y);
  const { low, high } = senSlopeInterval(x, y);
  return { firstAt: sorted[0].performedAt, slopeUmPerDay: line.slope, interceptUm: line.intercept, lowSlopeUmPerDay: low, highSlopeUmPerDay: high };
}

/**
 * Forecast for one tip position: `points` are its passing validations since its
 * last failure; `limitUm` the acceptance limit of the latest one.
 */
export function forecastDrift(points: DriftPoint[], limitUm: number, now: Date, timeZone: string): DriftForecast {
  const validations = points.length;
  if (validations < MIN_VALIDATIONS_FOR_FORECAST) return { state: 'not_enough_history', validations };
  const fit = fitDrift(points);
  const t0 = Date.parse(fit.firstAt);
  const nowDays = (now.getTime() - t0) / DAY_MS;
  const lastDays = Math.max(...points.map((p) => (Date.parse(p.performedAt) - t0) / DAY_MS));
  const level = (days: number) => fit.interceptUm + fit.slopeUmPerDay * days;
  const dayOf = (days: number) => calendarDayIn(new Date(t0 + days * DAY_MS), timeZone);
  const crossing = fit.slopeUmPerDay > 0 ? (limitUm - fit.interceptUm) / fit.slopeUmPerDay : null;

  if (level(nowDays) >= limitUm) return { state: 'past_limit', validations, limitUm, fit, reachedOn: crossing === null ? null : dayOf(crossing) };
  if (crossing === null || crossing - nowDays > FORECAST_HORIZON_DAYS) return { state: 'no_drift', validations, limitUm, fit };
  // From the fitted level at the latest validation, at the interval's steeper and shallower slopes.
  const from = level(lastDays);
  const at = (slope: number) => lastDays + (limitUm - from) / slope;
  const earliest = Math.min(at(fit.highSlopeUmPerDay), crossing);
  const latest = fit.lowSlopeUmPerDay > 0 ? Math.max(at(fit.lowSlopeUmPerDay), crossing) : null;
  return {
    state: 'forecast',
    validations,
    limitUm,
    fit,
    reachesOn: dayOf(crossing),
    earliestOn: dayOf(Math.max(earliest, nowDays)),
    latestOn: latest === null || latest - nowDays > FORECAST_HORIZON_DAYS ? null : dayOf(latest),
  };
}

/** Forecast to reach the limit on or before `untilDay` (the due-soon window's end), or already past it. */
export const failsBy = (forecast: DriftForecast, untilDay: string) =>
  forecast.state === 'past_limit' || (forecast.state === 'forecast' && forecast.reachesOn <= untilDay);
