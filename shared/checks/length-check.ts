import { distanceMm, toUm, type Point } from './geometry';

/** ISO 1:2022: the standard reference temperature for dimensional measurements. */
export const REFERENCE_TEMPERATURE_C = 20;

/** Expected length of a bar at temperature t: L20·(1 + α·(t − 20 °C)), α in µm/(m·K). */
export function expectedLengthMm(certifiedLengthMm: number, expansionPpmPerK: number, temperatureC: number): number {
  return certifiedLengthMm * (1 + expansionPpmPerK * 1e-6 * (temperatureC - REFERENCE_TEMPERATURE_C));
}

/** Length check: the scale bar measured between its end nests; error = measured − expected (µm, signed). */
export function lengthCheck(endA: Point, endB: Point, certifiedLengthMm: number, expansionPpmPerK: number, temperatureC: number) {
  const measuredMm = distanceMm(endA, endB);
  const expectedMm = expectedLengthMm(certifiedLengthMm, expansionPpmPerK, temperatureC);
  return { measuredMm, expectedMm, errorUm: toUm(measuredMm - expectedMm) };
}
