import { distanceMm, toUm, type Point } from './geometry';

/** Two-face check (ISO 10360-10, ASME B89.4.19): one target read in front face
 * and back face; the error is the distance between the two readings, in µm. */
export const twoFaceErrorUm = (front: Point, back: Point) => toUm(distanceMm(front, back));
