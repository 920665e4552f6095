/**
 * The engine's one set of tolerances. Lengths are in mm; a micrometre-scale part at 1:10 is far above
 * these, so they only absorb rounding.
 */
export const LENGTH_TOLERANCE_MM = 1e-9;
/** Angle tolerance, radians. */
export const ANGLE_TOLERANCE_RAD = 1e-12;

/** |a − b| ≤ absTol + relTol·max(|a|, |b|). */
export function approxEqual(a: number, b: number, absTol = LENGTH_TOLERANCE_MM, relTol = 0): boolean {
  return Math.abs(a - b) <= absTol + relTol * Math.max(Math.abs(a), Math.abs(b));
}
