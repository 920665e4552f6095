import type { Vec3 } from "./vec3";

/**
 * Rodrigues' rotation of vector v about the unit axis k by angleRad (right-hand rule: positive is
 * counter-clockwise looking down k towards the origin):
 *   v' = v·cos θ + (k × v)·sin θ + k·(k·v)·(1 − cos θ).
 * k must be a unit vector; the frame is whatever v and k share (the vehicle frame in this engine).
 */
export function vec3RotateAboutAxis(v: Vec3, k: Vec3, angleRad: number): Vec3 {
  const c = Math.cos(angleRad);
  const s = Math.sin(angleRad);
  const kv = k[0] * v[0] + k[1] * v[1] + k[2] * v[2];
  const t = kv * (1 - c);
  return [
    v[0] * c + (k[1] * v[2] - k[2] * v[1]) * s + k[0] * t,
    v[1] * c + (k[2] * v[0] - k[0] * v[2]) * s + k[1] * t,
    v[2] * c + (k[0] * v[1] - k[1] * v[0]) * s + k[2] * t,
  ];
}

/** Point p rotated by angleRad about the line through axisPoint along the unit axis k (Rodrigues). */
export function pointRotateAboutAxis(p: Vec3, axisPoint: Vec3, k: Vec3, angleRad: number): Vec3 {
  const r = vec3RotateAboutAxis([p[0] - axisPoint[0], p[1] - axisPoint[1], p[2] - axisPoint[2]], k, angleRad);
  return [r[0] + axisPoint[0], r[1] + axisPoint[1], r[2] + axisPoint[2]];
}

/**
 * Rotation about the vehicle x axis by angleRad (positive turns +y towards +z — in the front view,
 * seen from ahead, counter-clockwise with y to the right).
 */
export function vec3RotateX(v: Vec3, angleRad: number): Vec3 {
  const c = Math.cos(angleRad);
  const s = Math.sin(angleRad);
  return [v[0], v[1] * c - v[2] * s, v[1] * s + v[2] * c];
}
