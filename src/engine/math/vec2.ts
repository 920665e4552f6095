/**
 * A point or direction in one view plane, millimetres for points. In the front view the two components
 * are (y, z): y to the left (outboard for the left corner), z up, seen from ahead of the car.
 */
export type Vec2 = readonly [number, number];

/** Difference a − b. */
export function vec2Sub(a: Vec2, b: Vec2): Vec2 {
  return [a[0] - b[0], a[1] - b[1]];
}

/** Sum a + b. */
export function vec2Add(a: Vec2, b: Vec2): Vec2 {
  return [a[0] + b[0], a[1] + b[1]];
}

/** Dot product. */
export function vec2Dot(a: Vec2, b: Vec2): number {
  return a[0] * b[0] + a[1] * b[1];
}

/** Scalar cross product a × b = a0·b1 − a1·b0 (positive when b is counter-clockwise of a). */
export function vec2Cross(a: Vec2, b: Vec2): number {
  return a[0] * b[1] - a[1] * b[0];
}

/** Euclidean length. */
export function vec2Length(a: Vec2): number {
  return Math.hypot(a[0], a[1]);
}

/** Distance between two points. */
export function vec2Distance(a: Vec2, b: Vec2): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1]);
}

/** a rotated counter-clockwise by angleRad about the origin. */
export function vec2Rotate(a: Vec2, angleRad: number): Vec2 {
  const c = Math.cos(angleRad);
  const s = Math.sin(angleRad);
  return [a[0] * c - a[1] * s, a[0] * s + a[1] * c];
}

/** Angle of a from the first axis, counter-clockwise, radians in (−π, π]. */
export function vec2AngleRads(a: Vec2): number {
  return Math.atan2(a[1], a[0]);
}

/**
 * Intersection of line p1–p2 with line q1–q2 in homogeneous form [X, Y, W]: the point is (X/W, Y/W),
 * and W = 0 means the lines are parallel (meeting at infinity in direction (X, Y)). Never divides.
 */
export function lineIntersectionHomogeneous(p1: Vec2, p2: Vec2, q1: Vec2, q2: Vec2): readonly [number, number, number] {
  // Line through two points as the cross product of their homogeneous coordinates.
  const l1a = p1[1] - p2[1];
  const l1b = p2[0] - p1[0];
  const l1c = p1[0] * p2[1] - p2[0] * p1[1];
  const l2a = q1[1] - q2[1];
  const l2b = q2[0] - q1[0];
  const l2c = q1[0] * q2[1] - q2[0] * q1[1];
  return [l1b * l2c - l1c * l2b, l1c * l2a - l1a * l2c, l1a * l2b - l1b * l2a];
}
