import { distanceMm, meanPoint, toUm, type Point } from './geometry';

export const MIN_TIP_READINGS = 3;
export const DEFAULT_TIP_READINGS = 4;

/**
 * Tip validation (DESIGN.md §5): the SMR's reading in a nest is the reference
 * R; the probe tip, seated in a reference sphere sharing the SMR's centre, is
 * read n ≥ 3 times in different orientations. Reports each |Pi − R|, the mean
 * point's offset |P̄ − R|, the spread max |Pi − P̄|, and the largest |Pi − R|,
 * which the decision uses. Inputs in mm, results in µm.
 */
export function tipValidation(reference: Point, readings: Point[]) {
  if (readings.length < MIN_TIP_READINGS) throw new Error(`A tip validation needs at least ${MIN_TIP_READINGS} readings.`);
  const mean = meanPoint(readings);
  const deviationsUm = readings.map((p) => toUm(distanceMm(p, reference)));
  return {
    deviationsUm,
    meanOffsetUm: toUm(distanceMm(mean, reference)),
    spreadUm: toUm(Math.max(...readings.map((p) => distanceMm(p, mean)))),
    maxDeviationUm: Math.max(...deviationsUm),
  };
}
