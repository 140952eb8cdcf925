import { roundUm } from './rounding';

/**
 * A check's tolerance (DESIGN.md §5): fixed in micrometres, or range-dependent
 * A + B·L in the form maximum permissible errors take in ISO 10360-10 and
 * ASME B89.4.19 (A in µm, B in µm/m, L the distance from the tracker in metres).
 * The limit is rounded to 0.1 µm by the checks' rounding rule.
 */
export type Tolerance = { kind: 'fixed'; um: number } | { kind: 'range'; aUm: number; bUmPerM: number };

export function toleranceUm(tolerance: Tolerance, distanceM?: number | null): number {
  if (tolerance.kind === 'fixed') return roundUm(tolerance.um);
  if (distanceM === undefined || distanceM === null || !Number.isFinite(distanceM) || distanceM < 0) {
    throw new Error('A range-dependent tolerance needs the distance from the tracker in metres.');
  }
  // Stated to 0.1 µm like the results it is compared with (./rounding.ts): 15 + 6 × 2.05 is 27.3, not 27.299999999999997.
  return roundUm(tolerance.aUm + tolerance.bUmPerM * distanceM);
}
