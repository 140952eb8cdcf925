/**
 * Amounts the clerk types, in major units ("180", "180.5", "180,50"), as
 * integer minor units for a currency with `digits` decimals (EUR 2 → 18050;
 * JPY 0). Null when it is not a non-negative amount with at most that many decimals.
 */
export function parseAmount(text: string, digits: number): number | null {
  const t = text.trim().replace(/\s/g, '').replace(',', '.');
  const match = /^(\d+)(?:\.(\d*))?$/.exec(t);
  if (!match) return null;
  const fraction = match[2] ?? '';
  if (fraction.length > digits) return null;
  return Number(match[1]) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
}

/** Minor units as the text an amount input starts with: 18050 → "180.50" (no grouping, no symbol). */
export function amountText(minor: number, digits: number): string {
  return (minor / 10 ** digits).toFixed(digits);
}
