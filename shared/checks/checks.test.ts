import { create, all } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { decide } from './decision';
import { distanceMm, meanPoint } from './geometry';
import { expectedLengthMm, lengthCheck, REFERENCE_TEMPERATURE_C } from './length-check';
import { tipValidation } from './tip-validation';
import { toleranceUm } from './tolerance';
import { twoFaceErrorUm } from './two-face';
import { combinedStandardUncertainty, expandedUncertainty } from './uncertainty';

// Independent reference for the vector arithmetic: mathjs (a general-purpose
// linear-algebra library from the npm registry).
const math = create(all);
const vec = (p: { x: number; y: number; z: number }) => [p.x, p.y, p.z];
const mathDistance = (a: { x: number; y: number; z: number }, b: { x: number; y: number; z: number }) =>
  Number(math.norm(math.subtract(vec(a), vec(b)) as number[]));

const R = { x: 1523.412, y: -310.087, z: 95.334 };
const readings = [
  { x: 1523.419, y: -310.081, z: 95.338 },
  { x: 1523.405, y: -310.095, z: 95.329 },
  { x: 1523.421, y: -310.079, z: 95.341 },
  { x: 1523.408, y: -310.092, z: 95.327 },
];

describe('tip validation (DESIGN.md §5), checked against mathjs', () => {
  const result = tipValidation(R, readings);

  it('reports each |Pi − R| in µm', () => {
    expect(result.deviationsUm).toHaveLength(4);
    result.deviationsUm.forEach((d, i) => expect(d).toBeCloseTo(mathDistance(readings[i], R) * 1000, 1));
  });

  it('reports the mean point offset |P̄ − R| and the spread max |Pi − P̄|', () => {
    const mean = (math.mean(math.matrix(readings.map(vec)), 0) as unknown as { toArray(): number[] }).toArray();
    const meanPt = { x: mean[0], y: mean[1], z: mean[2] };
    expect(meanPoint(readings).x).toBeCloseTo(meanPt.x, 9);
    expect(result.meanOffsetUm).toBeCloseTo(mathDistance(meanPt, R) * 1000, 1);
    expect(result.spreadUm).toBeCloseTo(Math.max(...readings.map((p) => mathDistance(p, meanPt))) * 1000, 1);
  });

  it('decides on the largest deviation', () => {
    expect(result.maxDeviationUm).toBe(Math.max(...result.deviationsUm));
    expect(result.maxDeviationUm).toBeCloseTo(Math.max(...readings.map((p) => mathDistance(p, R))) * 1000, 1);
  });

  it('needs at least three readings', () => {
    expect(() => tipValidation(R, readings.slice(0, 2))).toThrow(/at least 3/);
  });

  it('is zero when every reading coincides with the reference (common practice: the ideal outcome)', () => {
    expect(tipValidation(R, [R, R, R])).toEqual({ deviationsUm: [0, 0, 0], meanOffsetUm: 0, spreadUm: 0, maxDeviationUm: 0 });
  });
});

describe('two-face check (ISO 10360-10 / ASME B89.4.19: the distance between front- and back-face readings)', () => {
  it('matches mathjs', () => {
    const front = { x: 8000.0, y: 120.0, z: 1500.0 };
    const back = { x: 8000.012, y: 119.991, z: 1500.02 };
    expect(twoFaceErrorUm(front, back)).toBeCloseTo(mathDistance(front, back) * 1000, 1);
    // 3-4-12 → 13: a Pythagorean quadruple, so the distance is exact (µm).
    expect(twoFaceErrorUm({ x: 0, y: 0, z: 0 }, { x: 0.003, y: 0.004, z: 0.012 })).toBe(13);
  });
});

describe('length check against the ISO 1 reference temperature and handbook expansion coefficients', () => {
  it('uses 20 °C as the reference temperature (ISO 1:2022)', () => {
    expect(REFERENCE_TEMPERATURE_C).toBe(20);
    expect(expectedLengthMm(2300, 11.5, 20)).toBe(2300);
  });

  // Coefficients: steel about 11–13, aluminium about 23, invar about 1.2 µm/(m·K)
  // (engineering handbook tables, as listed in DESIGN.md §5; from memory).
  it.each([
    ['steel', 1000, 11.5, 25, 1000.0575],
    ['aluminium', 1000, 23, 25, 1000.115],
    ['invar', 2000, 1.2, 15, 1999.988],
    ['carbon fibre bar', 2300, 0.5, 22.4, 2300.00276],
  ])('%s bar %i mm, α %f µm/(m·K) at %f °C → %f mm', (_material, l20, alpha, t, expected) => {
    expect(expectedLengthMm(l20, alpha, t)).toBeCloseTo(expected, 6);
  });

  it('reports the signed error measured − expected in µm', () => {
    // A steel bar read at 25 °C measuring exactly its certified 1000 mm is 57.5 µm short of what it should read.
    const r = lengthCheck({ x: 0, y: 0, z: 0 }, { x: 1000, y: 0, z: 0 }, 1000, 11.5, 25);
    expect(r.errorUm).toBeCloseTo(-57.5, 1);
    expect(r.measuredMm).toBe(distanceMm({ x: 0, y: 0, z: 0 }, { x: 1000, y: 0, z: 0 }));
  });
});

describe('tolerance', () => {
  it('is A + B·L for range-dependent limits (ISO 10360-10 MPE form)', () => {
    // A = 15 µm, B = 6 µm/m at 10 m → 75 µm.
    expect(toleranceUm({ kind: 'range', aUm: 15, bUmPerM: 6 }, 10)).toBe(75);
    expect(toleranceUm({ kind: 'fixed', um: 25 })).toBe(25);
    expect(() => toleranceUm({ kind: 'range', aUm: 15, bUmPerM: 6 })).toThrow(/distance/);
  });
});

describe('uncertainty (JCGM 100:2008)', () => {
  it('combines uncorrelated components by root sum of squares (GUM §5.1.2, eq. 10 with unit sensitivity coefficients)', () => {
    expect(combinedStandardUncertainty([3, 4])).toBe(5);
    expect(combinedStandardUncertainty([3, 4, 12])).toBe(13);
    const components = [2.1, 0.7, 3.3, 1.05];
    expect(combinedStandardUncertainty(components)).toBeCloseTo(Number(math.norm(components)), 12);
  });

  it('expands with the coverage factor k = 2 (GUM §6.2.1, §6.3.3)', () => {
    expect(expandedUncertainty([3, 4])).toBe(10);
  });
});

describe('decision rules (ILAC-G8:09/2019)', () => {
  // Tolerance limit 50 µm, expanded uncertainty U = 10 µm (k = 2).
  it.each([
    [39, 'pass', 'pass'], // well inside: passes under either rule
    [40, 'pass', 'pass'], // exactly on the acceptance limit TL − w
    [45, 'pass', 'fail'], // inside the guard band: simple acceptance passes, guarded acceptance does not
    [50, 'pass', 'fail'], // on the tolerance limit
    [51, 'fail', 'fail'], // outside the tolerance
  ])('result %f µm → simple %s, guarded %s', (result, simple, guarded) => {
    expect(decide(result, 50, 'simple', 10).decision).toBe(simple);
    const g = decide(result, 50, 'guarded', 10);
    expect(g.decision).toBe(guarded);
    expect(g.guardBandUm).toBe(10);
    expect(g.acceptanceLimitUm).toBe(40);
  });

  // ILAC-G8:09/2019 §4.2.1 (simple acceptance, w = 0: accepted when the measured value is within
  // the tolerance limit) and §4.2.2 (guarded acceptance, w = U); from memory. The limit here is the
  // brief's A + B·L = 15 µm + 6 µm/m × 2.05 m = 27.3 µm (arithmetic).
  const limit = toleranceUm({ kind: 'range', aUm: 15, bUmPerM: 6 }, 2.05);

  it('states A + B·L to 0.1 µm: 15 µm + 6 µm/m × 2.05 m = 27.3 µm (arithmetic)', () => {
    expect(limit).toBe(27.3);
  });

  it('passes a result equal to the limit under simple acceptance, however the limit was computed', () => {
    expect(decide(27.3, limit, 'simple').decision).toBe('pass');
    expect(decide(27.3, 15 + 6 * 2.05, 'simple').decision).toBe('pass'); // the raw binary sum 27.299999999999997
    expect(decide(-27.3, limit, 'simple').decision).toBe('pass');
    expect(decide(27.4, limit, 'simple').decision).toBe('fail');
    // A two-face error of exactly 27.3 µm measured by the tracker (0.0273 mm between the faces).
    expect(decide(twoFaceErrorUm({ x: 0, y: 0, z: 0 }, { x: 0.0273, y: 0, z: 0 }), limit, 'simple').decision).toBe('pass');
  });

  it('passes a result equal to the acceptance limit under guarded acceptance (w = U, k = 2)', () => {
    // u = √(1.2² + 1.6²) = 2.0 µm (a 3-4-5 triangle scaled by 0.4), U = 2u = 4.0 µm (GUM §6.2.1); 27.3 − 4.0 = 23.3 µm.
    const U = expandedUncertainty([1.2, 1.6]);
    const d = decide(23.3, limit, 'guarded', U);
    expect(d).toMatchObject({ decision: 'pass', toleranceUm: 27.3, expandedUncertaintyUm: 4, guardBandUm: 4, acceptanceLimitUm: 23.3 });
    expect(decide(23.4, limit, 'guarded', U).decision).toBe('fail');
    expect(decide(27.3, limit, 'guarded', U).decision).toBe('fail'); // inside the guard band
  });

  it('rounds the result by the same half-even rule before comparing, so results straddling the boundary fall the stated way', () => {
    const faces = (dxMm: number) => twoFaceErrorUm({ x: 0, y: 0, z: 0 }, { x: dxMm, y: 0, z: 0 });
    // 27.349… µm rounds to 27.3 and passes; 27.35 µm rounds to 27.4 (half to even) and fails.
    expect(faces(0.027349)).toBe(27.3);
    expect(decide(faces(0.027349), limit, 'simple').decision).toBe('pass');
    expect(faces(0.02735)).toBe(27.4);
    expect(decide(faces(0.02735), limit, 'simple').decision).toBe('fail');
    // 27.45 µm rounds to 27.4 (even), not 27.5: it passes a 27.4 µm limit, where half-up rounding would fail it.
    expect(faces(0.02745)).toBe(27.4);
    expect(decide(faces(0.02745), 27.4, 'simple').decision).toBe('pass');
    // The limit is rounded by the same rule: a stated 27.25 µm is 27.2 µm, so 27.25 µm (27.2) passes and 27.3 µm fails.
    expect(decide(27.25, 27.25, 'simple').decision).toBe('pass');
    expect(decide(27.3, 27.25, 'simple').decision).toBe('fail');
  });

  it('judges signed errors by their size', () => {
    expect(decide(-30, 50, 'simple').decision).toBe('pass');
    expect(decide(-60, 50, 'simple').decision).toBe('fail');
  });
});
