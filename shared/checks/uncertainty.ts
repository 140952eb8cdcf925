/**
 * JCGM 100:2008 (GUM) §5.1.2: for uncorrelated input quantities with unit
 * sensitivity coefficients the combined standard uncertainty is the root sum
 * of squares of the standard uncertainties; §6.2.1 expanded uncertainty U = k·u_c,
 * here with the coverage factor k = 2.
 */
export const COVERAGE_FACTOR = 2;

export function combinedStandardUncertainty(componentsUm: number[]): number {
  return Math.sqrt(componentsUm.reduce((sum, u) => sum + u * u, 0));
}

export const expandedUncertainty = (componentsUm: number[], k = COVERAGE_FACTOR) => k * combinedStandardUncertainty(componentsUm);
