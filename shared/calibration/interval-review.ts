/**
 * Calibration interval review by the "automatic adjustment" (staircase)
 * method of OIML D 10 / ILAC-G24: after each calibration the next interval is
 * lengthened when the item has been found in tolerance several times in a
 * row, and shortened when it was found out of tolerance. The factors, the
 * run length and the limits are the firm's settings; a person accepts or
 * declines each suggestion.
 *
 * A suggestion never moves against the evidence: after an out-of-tolerance
 * result it shortens or keeps, never lengthens; after in-tolerance results it
 * lengthens or keeps, never shortens. The policy's limits bound a move, they
 * never reverse one: an interval outside the policy's range that the evidence
 * would not bring back inside is reported as `outside_policy`, for a person.
 */
export type AsFound = 'in_tolerance' | 'out_of_tolerance' | 'not_reported';

export type IntervalPolicy = {
  /** In-tolerance results in a row before lengthening. */
  lengthenAfter: number;
  lengthenFactor: number;
  shortenFactor: number;
  minMonths: number;
  maxMonths: number;
};

/** Starting values (from memory of common use of the staircase method; set your own). */
export const defaultIntervalPolicy: IntervalPolicy = { lengthenAfter: 2, lengthenFactor: 1.25, shortenFactor: 0.5, minMonths: 3, maxMonths: 36 };

export type IntervalChange = 'lengthen' | 'shorten' | 'keep' | 'outside_policy';
export const intervalChanges: readonly IntervalChange[] = ['lengthen', 'shorten', 'keep', 'outside_policy'];

export type IntervalSuggestion =
  | { suggestedMonths: number; change: 'lengthen' | 'shorten' | 'keep'; reason: string }
  /** The current interval stays; a person decides, the policy's range beside it. */
  | { suggestedMonths: number; change: 'outside_policy'; reason: string; policyRange: { minMonths: number; maxMonths: number } };

const monthsText = (n: number) => `${n} month${n === 1 ? '' : 's'}`;

/** `history` is the as-found results, oldest first, the newest being the calibration just recorded. */
export function suggestInterval(currentMonths: number, history: AsFound[], policy: IntervalPolicy = defaultIntervalPolicy): IntervalSuggestion {
  const { minMonths, maxMonths } = policy;
  const range = `${minMonths}–${maxMonths} months`;
  const latest = history[history.length - 1];
  const run = history.slice(-policy.lengthenAfter);
  const evidence: 'shorten' | 'lengthen' | 'keep' =
    latest === 'out_of_tolerance' ? 'shorten' : run.length === policy.lengthenAfter && run.every((r) => r === 'in_tolerance') ? 'lengthen' : 'keep';
  const evidenceWords = {
    shorten: 'Found out of tolerance',
    lengthen: `${policy.lengthenAfter} in-tolerance results in a row`,
    keep: latest === 'not_reported' ? 'No as-found result reported' : 'Not enough in-tolerance results in a row yet',
  }[evidence];

  // Outside the range: only a move the evidence calls for, and that heads back into the range, is suggested.
  const below = currentMonths < minMonths;
  const above = currentMonths > maxMonths;
  if ((below && evidence !== 'lengthen') || (above && evidence !== 'shorten')) {
    return {
      suggestedMonths: currentMonths,
      change: 'outside_policy',
      reason: `${evidenceWords}, but ${monthsText(currentMonths)} is ${below ? 'below' : 'above'} the policy's range of ${range}: set the interval by hand.`,
      policyRange: { minMonths, maxMonths },
    };
  }

  if (evidence === 'keep') return { suggestedMonths: currentMonths, change: 'keep', reason: `${evidenceWords}: keep the interval.` };
  const clamp = (m: number) => Math.min(maxMonths, Math.max(minMonths, m));
  if (evidence === 'shorten') {
    const suggestedMonths = Math.min(currentMonths, clamp(Math.floor(currentMonths * policy.shortenFactor)));
    return suggestedMonths < currentMonths
      ? {
          suggestedMonths,
          change: 'shorten',
          reason: `${evidenceWords}: shorten by ×${policy.shortenFactor}${suggestedMonths === minMonths ? ` (the policy's minimum is ${monthsText(minMonths)})` : ''}.`,
        }
      : {
          suggestedMonths,
          change: 'keep',
          reason: `${evidenceWords}, but ${currentMonths <= minMonths ? `the interval is already at the policy's minimum of ${monthsText(minMonths)}` : `×${policy.shortenFactor} changes no whole month`}: keep it.`,
        };
  }
  const suggestedMonths = Math.max(currentMonths, clamp(Math.round(currentMonths * policy.lengthenFactor)));
  return suggestedMonths > currentMonths
    ? {
        suggestedMonths,
        change: 'lengthen',
        reason: `${evidenceWords}: lengthen by ×${policy.lengthenFactor}${suggestedMonths === maxMonths ? ` (the policy's maximum is ${monthsText(maxMonths)})` : ''}.`,
      }
    : {
        suggestedMonths,
        change: 'keep',
        reason: `${evidenceWords}, but ${currentMonths >= maxMonths ? `the interval is already at the policy's maximum of ${monthsText(maxMonths)}` : `×${policy.lengthenFactor} changes no whole month`}: keep it.`,
      };
}
