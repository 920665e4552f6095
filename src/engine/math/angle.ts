/** Degrees per radian and its inverse; conversions go through the two functions below. */
const RAD_PER_DEG = Math.PI / 180;
const DEG_PER_RAD = 180 / Math.PI;

/** Degrees → radians. */
export function degToRad(deg: number): number {
  return deg * RAD_PER_DEG;
}

/** Radians → degrees. */
export function radToDeg(rad: number): number {
  return rad * DEG_PER_RAD;
}

/** An angle wrapped into (−π, π] radians. */
export function angleNormalizeRads(rad: number): number {
  let a = rad % (2 * Math.PI);
  if (a <= -Math.PI) a += 2 * Math.PI;
  else if (a > Math.PI) a -= 2 * Math.PI;
  return a;
}

/** x clamped into [−1, 1], so acos/asin of a rounding-polluted cosine never gives NaN. */
export function clampUnit(x: number): number {
  return x > 1 ? 1 : x < -1 ? -1 : x;
}

/** Cotangent of an angle in radians (Infinity at 0 — callers guard). */
export function cotRads(rad: number): number {
  return Math.cos(rad) / Math.sin(rad);
}
