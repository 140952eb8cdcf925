import { describe, expect, it } from 'vitest';
import { formatWattHours, shippingClass, shippingSheet, wattHours, wattHoursDigits } from './shipping-class';

// Source for the thresholds: IATA Dangerous Goods Regulations, passenger provisions
// for lithium-ion batteries (Table 2.3.A) as summarised in IATA's "Lithium Battery
// Guidance Document" (2022, after DGR 63rd ed.): ≤ 100 Wh allowed; > 100 Wh and ≤ 160 Wh
// with operator approval; > 160 Wh forbidden in passenger baggage. Thresholds from memory of
// that document; "a watt-hour rating of not more than 100 Wh" read in the 2024 edition of
// "Lithium Batteries — International Transport Regulations" (lithium.batteriestransport.org, p. 35).
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
    // 14.4 V × 6.8 Ah = 97.92 Wh; 14.4 V × 10.4 Ah = 149.76 Wh (arithmetic).
    expect(sheet.lines.map((l) => l.class)).toEqual(['up_to_100_wh', 'over_100_to_160_wh']);
    expect(sheet.lines[0].wattHours).toBeCloseTo(97.92, 10);
    expect(sheet.lines[1].wattHours).toBeCloseTo(149.76, 10);
    expect(sheet.totalWattHours).toBeCloseTo(247.68, 10);
    expect(sheet.strictest).toBe('over_100_to_160_wh');
    expect(shippingSheet([]).strictest).toBeNull();
  });
});

describe('watt-hours as written: never rounded across a class threshold (IATA DGR: 100 Wh and 160 Wh)', () => {
  // Intl puts no no-break space in these en-US figures; the expected texts are written by hand.
  it.each([
    [97.92, '97.9 Wh', 'up_to_100_wh'],
    [100, '100.0 Wh', 'up_to_100_wh'], // "not exceeding 100 Wh"
    [99.96, '100.0 Wh', 'up_to_100_wh'], // shown as 100.0, which is still ≤ 100 Wh: the same class
    [100.04, '100.04 Wh', 'over_100_to_160_wh'], // not "100.0 Wh": that would read as the lower class
    [10.8 * 9.263, '100.04 Wh', 'over_100_to_160_wh'], // 100.0404 Wh from V × Ah
    [100.0004, '100.0004 Wh', 'over_100_to_160_wh'],
    [149.76, '149.8 Wh', 'over_100_to_160_wh'],
    [160.04, '160.04 Wh', 'over_160_wh'],
    [160.001, '160.001 Wh', 'over_160_wh'],
    [1234.5, '1,234.5 Wh', 'over_160_wh'],
  ] as const)('%f Wh is written "%s" (%s)', (wh, text, cls) => {
    expect(shippingClass(wh)).toBe(cls);
    expect(formatWattHours(wh, 'en-US')).toBe(text);
  });

  it('shows, for every value from 99.900 to 100.100 and 159.900 to 160.100 Wh in steps of 0.001, a figure of the same class', () => {
    const wrong: string[] = [];
    for (const base of [99_900, 159_900]) {
      for (let k = 0; k <= 200; k += 1) {
        const wh = (base + k) / 1000;
        const shown = Number(formatWattHours(wh, 'en-US').replace(/,/g, '').replace(' Wh', ''));
        if (shippingClass(shown) !== shippingClass(wh)) wrong.push(`${wh} shown as ${shown}`);
      }
    }
    expect(wrong).toEqual([]);
    expect(wattHoursDigits(98)).toBe(1);
  });
});
