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

export type BatteryForShipping = { assetTag: string; nominalVoltageV: number; ratedCapacityAh: number; damaged: boolean };

/** A kit's batteries with each one's Wh and class, the total Wh and the strictest class. */
export function shippingSheet(batteries: BatteryForShipping[]) {
  const lines = batteries.map((b) => {
    const wh = wattHours(b.nominalVoltageV, b.ratedCapacityAh);
    return { ...b, wattHours: Math.round(wh * 10) / 10, class: shippingClass(wh, b.damaged) };
  });
  const order: ShippingClass[] = ['up_to_100_wh', 'over_100_to_160_wh', 'over_160_wh', 'damaged_do_not_fly'];
  const strictest = lines.reduce<ShippingClass | null>((worst, l) => (worst === null || order.indexOf(l.class) > order.indexOf(worst) ? l.class : worst), null);
  const totalWattHours = Math.round(lines.reduce((sum, l) => sum + wattHours(l.nominalVoltageV, l.ratedCapacityAh), 0) * 10) / 10;
  return { lines, totalWattHours, strictest, count: lines.length };
}
