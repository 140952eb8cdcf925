/**
 * Calibration interval review by the "automatic adjustment" (staircase)
 * method of OIML D 10 / ILAC-G24: after each calibration the next interval is
 * lengthened when the item has been found in tolerance several times in a
 * row, and shortened when it was found out of tolerance. The factors, the
 * run length and the limits are the firm's settings; a person accepts or
 * declines each suggestion.
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

export type IntervalSuggestion = { suggestedMonths: number; change: 'lengthen' | 'shorten' | 'keep'; reason: string };

/** `history` is the as-found results, oldest first, the newest being the calibration just recorded. */
export function suggestInterval(currentMonths: number, history: AsFound[], policy: IntervalPolicy = defaultIntervalPolicy): IntervalSuggestion {
  const clamp = (m: number) => Math.min(policy.maxMonths, Math.max(policy.minMonths, m));
  const latest = history[history.length - 1];
  if (latest === 'out_of_tolerance') {
    const suggestedMonths = clamp(Math.floor(currentMonths * policy.shortenFactor));
    return { suggestedMonths, change: suggestedMonths < currentMonths ? 'shorten' : 'keep', reason: `Found out of tolerance: shorten by ×${policy.shortenFactor}.` };
  }
  const run = history.slice(-policy.lengthenAfter);
  if (run.length === policy.lengthenAfter && run.every((r) => r === 'in_tolerance')) {
    const suggestedMonths = clamp(Math.round(currentMonths * policy.lengthenFactor));
    return {
      suggestedMonths,
      change: suggestedMonths > currentMonths ? 'lengthen' : 'keep',
      reason: `${policy.lengthenAfter} in-tolerance results in a row: lengthen by ×${policy.lengthenFactor}.`,
    };
  }
  return { suggestedMonths: currentMonths, change: 'keep', reason: latest === 'not_reported' ? 'No as-found result reported: keep the interval.' : 'Not enough in-tolerance results in a row yet: keep the interval.' };
}
