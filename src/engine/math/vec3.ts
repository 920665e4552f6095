/** A point or direction in the vehicle frame (ISO 8855: x forward, y left, z up), millimetres for points. */
export type Vec3 = readonly [number, number, number];

/** Sum a + b. */
export function vec3Add(a: Vec3, b: Vec3): Vec3 {
  return [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
}

/** Difference a − b (the vector from b to a). */
export function vec3Sub(a: Vec3, b: Vec3): Vec3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}

/** a scaled by s. */
export function vec3Scale(a: Vec3, s: number): Vec3 {
  return [a[0] * s, a[1] * s, a[2] * s];
}

/** Dot product a·b. */
export function vec3Dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

/** Cross product a × b (right-handed). */
export function vec3Cross(a: Vec3, b: Vec3): Vec3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

/** Euclidean length |a|. */
export function vec3Length(a: Vec3): number {
  return Math.sqrt(a[0] * a[0] + a[1] * a[1] + a[2] * a[2]);
}

/** Distance |a − b| between two points. */
export function vec3Distance(a: Vec3, b: Vec3): number {
  return vec3Length(vec3Sub(a, b));
}

/** Unit vector along a, or null when a is (numerically) the zero vector. */
export function vec3Normalize(a: Vec3): Vec3 | null {
  const len = vec3Length(a);
  if (!(len > 1e-300)) return null;
  return [a[0] / len, a[1] / len, a[2] / len];
}

/** Mirror a point or vector of the left corner to the right corner (y → −y). */
export function vec3MirrorY(a: Vec3): Vec3 {
  return [a[0], -a[1], a[2]];
}
