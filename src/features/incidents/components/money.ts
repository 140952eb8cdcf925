/**
 * An amount typed in major units ("120", "120.5", "120,50") as integer minor
 * units for a currency with `digits` decimals (EUR 2 → 12050; JPY 0). Null when
 * it is not a non-negative amount with at most that many decimals.
 */
export function parseAmount(text: string, digits: number): number | null {
  const t = text.trim().replace(/\s/g, '').replace(',', '.');
  const match = /^(\d+)(?:\.(\d*))?$/.exec(t);
  if (!match) return null;
  const fraction = match[2] ?? '';
  if (fraction.length > digits) return null;
  return Number(match[1]) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
}
