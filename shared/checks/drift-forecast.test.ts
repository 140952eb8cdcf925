import { describe, expect, it } from 'vitest';
import { failsBy, fitDrift, forecastDrift, senSlopeInterval, type DriftPoint } from './drift-forecast';

const t0 = Date.UTC(2026, 0, 5, 9);
const series = (days: number[], um: number[]): DriftPoint[] =>
  days.map((d, i) => ({ performedAt: new Date(t0 + d * 86_400_000).toISOString(), maxDeviationUm: um[i] }));
const at = (iso: string) => new Date(iso);

// Invented tip histories. Check values: scipy.stats.theilslopes(y, x, method='joint'), scipy 1.17.1, computed offline
// (method='joint' takes the intercept as the median of y − slope·x, as ml-regression-theil-sen does). Where a count is
// even, ml-regression-theil-sen takes the lower of the two middle values and numpy's median their mean: those check values
// are the lower middle value of numpy.sort(...), numpy 2 with scipy 1.17.1, computed offline (marked "lower middle").
const rising = series([0, 30, 61, 90, 122, 150], [12.1, 13.0, 14.6, 14.2, 16.9, 17.3]);
const withTies = series([0, 14, 28, 28, 56, 70, 84], [20.0, 21.5, 21.5, 23.0, 24.5, 24.0, 26.5]);
const flat = series([0, 30, 60, 90, 120], [12.0, 12.2, 11.9, 12.1, 11.8]);

describe('Theil–Sen drift fit against scipy.stats.theilslopes', () => {
  it.each([
    ['a rising series (intercept: lower middle of 6)', rising, 0.03583333333333334, 11.925, 0.014285714285714362, 0.05166666666666669],
    ['a series with ties in time and deviation', withTies, 0.07142857142857142, 20.5, 0.044642857142857144, 0.10714285714285714],
    ['a flat series', flat, -0.0016666666666666607, 12.0, -0.009999999999999964, 0.006666666666666643],
  ])('%s: slope, intercept and the 95 %% slope interval', (_, points, slope, intercept, low, high) => {
    const fit = fitDrift(points);
    expect(fit.slopeUmPerDay).toBeCloseTo(slope, 12);
    expect(fit.interceptUm).toBeCloseTo(intercept, 12);
    expect(fit.lowSlopeUmPerDay).toBeCloseTo(low, 12);
    expect(fit.highSlopeUmPerDay).toBeCloseTo(high, 12);
  });

  it('picks the interval among the pairwise slopes as Sen (1968) eq. 2.6 does', () => {
    // Four points, no ties: six slopes; σ² = 4·3·13/18 = 8.667, (6 ± 1.96·2.944)/2 → indices 0 and 5 (scipy, same values).
    expect(senSlopeInterval([0, 20, 40, 60], [40, 48, 55, 58])).toEqual({ low: 0.15, high: 0.4 });
  });
});

describe('tip drift forecast', () => {
  it('forecasts the day a rising series reaches the limit, with an interval around it', () => {
    const f = forecastDrift(rising, 30, at('2026-06-10T12:00:00Z'), 'UTC');
    // Dates: Python datetime(2026, 1, 5, 9) + timedelta(days=…) over the fit above, computed offline:
    // crossing (30 − intercept)/slope → 2027-05-24 19:02; from the fitted level on day 150 at scipy's high slope
    // → 2027-02-05 04:21, at its low slope → 2028-11-09 09:00.
    expect(f).toMatchObject({ state: 'forecast', validations: 6, limitUm: 30, reachesOn: '2027-05-24', earliestOn: '2027-02-05', latestOn: '2028-11-09' });
    expect(failsBy(f, '2027-05-23')).toBe(false);
    expect(failsBy(f, '2027-05-24')).toBe(true);
  });

  it('gives the date in the firm time zone', () => {
    // 2027-05-24 19:02 UTC is 25 May 07:02 in Auckland (NZST, UTC+12) and 24 May 12:02 in Los Angeles (PDT, UTC−7), from memory of the offsets.
    expect(forecastDrift(rising, 30, at('2026-06-10T12:00:00Z'), 'Pacific/Auckland')).toMatchObject({ reachesOn: '2027-05-25' });
    expect(forecastDrift(rising, 30, at('2026-06-10T12:00:00Z'), 'America/Los_Angeles')).toMatchObject({ reachesOn: '2027-05-24' });
  });

  it('makes no forecast for a flat series', () => {
    const f = forecastDrift(flat, 30, at('2026-06-10T12:00:00Z'), 'UTC');
    expect(f.state).toBe('no_drift');
    expect(failsBy(f, '2099-01-01')).toBe(false);
  });

  it('says there is not enough history below four passing validations', () => {
    expect(forecastDrift(rising.slice(0, 3), 30, at('2026-06-10T12:00:00Z'), 'UTC')).toEqual({ state: 'not_enough_history', validations: 3 });
    expect(forecastDrift([], 30, at('2026-06-10T12:00:00Z'), 'UTC')).toEqual({ state: 'not_enough_history', validations: 0 });
  });

  it('reports a series whose line is already past the limit, with the day it crossed', () => {
    // Six pairwise slopes: lower middle 0.3 µm/day (scipy's mean of the middle two is 0.325), intercept (lower middle) 40.0 µm;
    // (60 − 40)/0.3 days after 2026-01-05 09:00 → 2026-03-13 01:00 (numpy and Python datetime, offline).
    const f = forecastDrift(series([0, 20, 40, 60], [40, 48, 55, 58]), 60, at('2026-04-01T09:00:00Z'), 'UTC');
    expect(f).toMatchObject({ state: 'past_limit', reachedOn: '2026-03-13', fit: { slopeUmPerDay: 0.3, interceptUm: 40 } });
    expect(failsBy(f, '2026-04-01')).toBe(true);
  });

  it('a guard band lowers the limit and so brings the forecast forward', () => {
    const simple = forecastDrift(rising, 30, at('2026-06-10T12:00:00Z'), 'UTC');
    const guarded = forecastDrift(rising, 30 - 4, at('2026-06-10T12:00:00Z'), 'UTC');
    expect(simple.state === 'forecast' && guarded.state === 'forecast' && guarded.reachesOn < simple.reachesOn).toBe(true);
  });
});
