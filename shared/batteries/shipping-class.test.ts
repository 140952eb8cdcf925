import { describe, expect, it } from 'vitest';
import { shippingClass, shippingSheet, wattHours } from './shipping-class';

// Source for the thresholds: IATA Dangerous Goods Regulations, passenger provisions
// for lithium-ion batteries (Table 2.3.A) as summarised in IATA's "Lithium Battery
// Guidance Document": ≤ 100 Wh allowed; > 100 Wh and ≤ 160 Wh with operator approval;
// > 160 Wh forbidden in passenger baggage. Thresholds from memory of that document.
describe('battery watt-hours', () => {
  it('is nominal voltage × rated capacity (Wh = V × Ah, the IATA guidance formula)', () => {
    expect(wattHours(14.4, 6.8)).toBeCloseTo(97.92, 10);
    expect(wattHours(10.8, 10)).toBeCloseTo(108, 10);
    // IATA guidance worked example, from memory: 3.7 V × 2.2 Ah = 8.14 Wh.
    expect(wattHours(3.7, 2.2)).toBeCloseTo(8.14, 10);
  });
});

describe('battery shipping class (IATA DGR lithium-ion thresholds)', () => {
  it.each([
    [99.9, 'up_to_100_wh'],
    [100, 'up_to_100_wh'], // "not exceeding 100 Wh"
    [100.1, 'over_100_to_160_wh'],
    [160, 'over_100_to_160_wh'], // "exceeding 100 Wh but not exceeding 160 Wh"
    [160.1, 'over_160_wh'],
    [400, 'over_160_wh'],
  ] as const)('%f Wh → %s', (wh, expected) => {
    expect(shippingClass(wh)).toBe(expected);
  });

  it('never lets a damaged battery fly whatever its size (IATA DGR: damaged or defective cells are forbidden for air transport)', () => {
    expect(shippingClass(20, true)).toBe('damaged_do_not_fly');
  });

  it("totals a kit's batteries and names the strictest class", () => {
    const sheet = shippingSheet([
      { assetTag: 'BAT-001', nominalVoltageV: 14.4, ratedCapacityAh: 6.8, damaged: false },
      { assetTag: 'BAT-002', nominalVoltageV: 14.4, ratedCapacityAh: 10.4, damaged: false },
    ]);
    expect(sheet.lines.map((l) => [l.wattHours, l.class])).toEqual([
      [97.9, 'up_to_100_wh'],
      [149.8, 'over_100_to_160_wh'],
    ]);
    expect(sheet.totalWattHours).toBe(247.7);
    expect(sheet.strictest).toBe('over_100_to_160_wh');
    expect(shippingSheet([]).strictest).toBeNull();
  });
});
