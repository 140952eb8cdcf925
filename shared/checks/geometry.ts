import { roundUm } from './rounding';

/** Points in millimetres, as a tracker reports them. */
export type Point = { x: number; y: number; z: number };

export const distanceMm = (a: Point, b: Point) => Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z);

export function meanPoint(points: Point[]): Point {
  const n = points.length;
  return {
    x: points.reduce((s, p) => s + p.x, 0) / n,
    y: points.reduce((s, p) => s + p.y, 0) / n,
    z: points.reduce((s, p) => s + p.z, 0) / n,
  };
}

/** Millimetres to micrometres, rounded to 0.1 µm by the checks' one rounding rule (half to even). */
export const toUm = (mm: number) => roundUm(mm * 1000);
