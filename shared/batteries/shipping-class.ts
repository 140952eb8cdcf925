/**
 * Lithium-ion battery shipping class (DESIGN.md §5). The watt-hour rating is
 * nominal voltage × rated capacity; the thresholds are the IATA Dangerous
 * Goods Regulations' passenger limits for lithium-ion batteries: up to 100 Wh,
 * more than 100 Wh up to 160 Wh with the operator's approval, more than 160 Wh
 * not in passenger baggage. A damaged battery never flies.
 */
export type ShippingClass = 'up_to_100_wh' | 'over_100_to_160_wh' | 'over_160_wh' | 'damaged_do_not_fly';

export const shippingClassText: Record<ShippingClass, string> = {
  up_to_100_wh: 'Up to 100 Wh',
  over_100_to_160_wh: 'Over 100 to 160 Wh: carrier approval needed',
  over_160_wh: 'Over 160 Wh: not in passenger baggage',
  damaged_do_not_fly: 'Damaged: do not fly, do not charge',
};

export function wattHours(nominalVoltageV: number, ratedCapacityAh: number): number {
  return nominalVoltageV * ratedCapacityAh;
}

export function shippingClass(wh: number, damaged = false): ShippingClass {
  if (damaged) return 'damaged_do_not_fly';
  if (wh <= 100) return 'up_to_100_wh';
  if (wh <= 160) return 'over_100_to_160_wh';
  return 'over_160_wh';
}

const MAX_WH_DIGITS = 6;
const plainFormats = new Map<number, Intl.NumberFormat>();
/** The figure shown with `digits` decimals, as a number (Intl's own rounding, the same in every locale). */
function shownWh(wh: number, digits: number): number {
  let format = plainFormats.get(digits);
  if (!format) {
    format = new Intl.NumberFormat('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false });
    plainFormats.set(digits, format);
  }
  return Number(format.format(wh));
}

/**
 * Decimals to show a watt-hour figure with: one, or as many more as it takes for
 * the figure shown to fall in the same class as the battery — never rounded across
 * the 100 Wh or 160 Wh threshold (100.04 Wh is shown as 100.04, not 100.0).
 */
export function wattHoursDigits(wh: number): number {
  for (let digits = 1; digits < MAX_WH_DIGITS; digits += 1) if (shippingClass(shownWh(wh, digits)) === shippingClass(wh)) return digits;
  return MAX_WH_DIGITS;
}

/** "97.9 Wh", "100.04 Wh": the one way Wh are written (screens, the shipping sheet PDF); `locale` undefined means the runtime's own. */
export function formatWattHours(wh: number, locale?: string): string {
  const digits = wattHoursDigits(wh);
  return `${new Intl.NumberFormat(locale, { minimumFractionDigits: digits, maximumFractionDigits: digits }).format(wh)} Wh`;
}

export type BatteryForShipping = { assetTag: string; nominalVoltageV: number; ratedCapacityAh: number; damaged: boolean };

/** A kit's batteries with each one's Wh and class, the total Wh and the strictest class. */
export function shippingSheet(batteries: BatteryForShipping[]) {
  const lines = batteries.map((b) => {
    const wh = wattHours(b.nominalVoltageV, b.ratedCapacityAh);
    // Unrounded: a rounded figure could sit in another class than the battery (show it with formatWattHours).
    return { ...b, wattHours: wh, class: shippingClass(wh, b.damaged) };
  });
  const order: ShippingClass[] = ['up_to_100_wh', 'over_100_to_160_wh', 'over_160_wh', 'damaged_do_not_fly'];
  const strictest = lines.reduce<ShippingClass | null>((worst, l) => (worst === null || order.indexOf(l.class) > order.indexOf(worst) ? l.class : worst), null);
  const totalWattHours = lines.reduce((sum, l) => sum + l.wattHours, 0);
  return { lines, totalWattHours, strictest, count: lines.length };
}
