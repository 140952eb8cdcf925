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

/** The locale's grouping and decimal marks, read from Intl once per locale. */
const marks = new Map<string, { group: string; decimal: string }>();
function marksOf(locale: string) {
  let m = marks.get(locale);
  if (!m) {
    const parts = new Intl.NumberFormat(locale).formatToParts(12345.6);
    m = { group: parts.find((p) => p.type === 'group')?.value ?? ',', decimal: parts.find((p) => p.type === 'decimal')?.value ?? '.' };
    marks.set(locale, m);
  }
  return m;
}

/**
 * An amount typed as money the way the firm writes it ("€25,000.00", "25.000,00 €", "25000"), as minor units. The
 * currency sign goes; thousands marks count as such only in whole groups of three, so "180,50" stays 180.50.
 */
export function parseMoneyText(text: string, digits: number, locale: string): number | null {
  const bare = text.replace(/[^\d.,'\u00a0\u202f\s-]/g, '').replace(/[\s\u00a0\u202f]/g, '');
  const { group, decimal } = marksOf(locale);
  const g = group.replace(/[\s\u00a0\u202f]/g, '');
  const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const grouped = g && new RegExp(`^\\d{1,3}(${escape(g)}\\d{3})+(${escape(decimal)}\\d*)?$`).test(bare);
  return parseAmount(grouped ? bare.split(g).join('').replace(decimal, '.') : bare, digits);
}
