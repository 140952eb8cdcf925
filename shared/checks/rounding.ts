/**
 * The one rounding rule for check arithmetic (DEVELOPERS.md "Check arithmetic").
 * Every number a decision compares — the result, the tolerance limit and the
 * expanded uncertainty used as guard band — is stated in whole tenths of a
 * micrometre, rounded half to even (the rounding method of ASTM E29: round the
 * observed value to the places of the limit, then compare). The comparison is
 * then between integers, so a result equal to its limit is judged equal:
 * 15 µm + 6 µm/m × 2.05 m is 27.299999999999997 in binary floating point, and
 * is 273 tenths here, as is a measured 27.3 µm.
 */
export const TENTHS_PER_UM = 10;

/** Binary noise of a product or sum sits near 1e-12 of a tenth; six places keep every real digit. */
const NOISE_PLACES = 6;

/** A value in µm as whole tenths of a micrometre, rounded half to even. */
export function tenthsOfUm(um: number): number {
  if (!Number.isFinite(um)) throw new Error(`Not a number of micrometres: ${um}`);
  const scaled = Number((um * TENTHS_PER_UM).toFixed(NOISE_PLACES));
  const below = Math.floor(scaled);
  const fraction = scaled - below;
  const rounded = fraction > 0.5 ? below + 1 : fraction < 0.5 ? below : below % 2 === 0 ? below : below + 1;
  return rounded + 0; // never −0
}

/** A value in µm rounded by the same rule, for storing and showing (27.3, not 27.299999999999997). */
export const roundUm = (um: number) => tenthsOfUm(um) / TENTHS_PER_UM;
