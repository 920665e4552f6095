import { GeometryError } from "../errors";
import { clampUnit, degToRad, radToDeg } from "../math/angle";
import { vec3RotateAboutAxis } from "../math/rotation";
import type { Vec3 } from "../math/vec3";

/** A steering (kingpin) axis: a point on it and its unit direction pointing up, vehicle frame, left corner. */
export interface KingpinAxis {
  readonly point: Vec3;
  readonly direction: Vec3;
}

/**
 * Unit kingpin-axis direction of the LEFT corner from projected angles (REFERENCES §5.3 [D]):
 * k = (−tan τ, −tan σ, 1)/√(1 + tan²τ + tan²σ), σ = kingpin inclination (+ top inboard), τ = caster
 * (+ top rearward), degrees, each within ±89°.
 */
export function kingpinAxisFromAnglesDeg(kpiDeg: number, casterDeg: number): Vec3 {
  const ts = Math.tan(degToRad(kpiDeg));
  const tc = Math.tan(degToRad(casterDeg));
  const n = Math.sqrt(1 + ts * ts + tc * tc);
  return [-tc / n, -ts / n, 1 / n];
}

/**
 * Kingpin axis of the left corner through the lower and upper ball joints (front view, y–z, mm), tilted
 * rearward in side view by the caster angle (degrees, + top rearward) and passing, at wheel-centre height
 * zWheelMm, casterOffsetMm ahead of the wheel centre (x = casterOffsetMm there). The arms hinge about x,
 * so the front-view projection is the line through the two ball joints. Upper must be above lower.
 */
export function kingpinAxisFromBallJoints(
  lower: readonly [number, number],
  upper: readonly [number, number],
  casterDeg: number,
  casterOffsetMm: number,
  zWheelMm: number,
): KingpinAxis {
  const dy = upper[0] - lower[0];
  const dz = upper[1] - lower[1];
  if (!(dz > 1e-9)) throw new GeometryError("kingpin axis", "the upper ball joint must be above the lower ball joint");
  const tc = Math.tan(degToRad(casterDeg));
  const dx = -dz * tc;
  const n = Math.sqrt(dx * dx + dy * dy + dz * dz);
  const xAtLower = casterOffsetMm - (lower[1] - zWheelMm) * tc;
  return { point: [xAtLower, lower[0], lower[1]], direction: [dx / n, dy / n, dz / n] };
}

/** Where the axis pierces the horizontal plane z = zGroundMm (mm). */
export function kingpinGroundPoint(axis: KingpinAxis, zGroundMm: number): Vec3 {
  const t = (zGroundMm - axis.point[2]) / axis.direction[2];
  return [axis.point[0] + t * axis.direction[0], axis.point[1] + t * axis.direction[1], zGroundMm];
}

/** Steer-axis figures of the left corner at one pose. Lengths mm, angles degrees. */
export interface SteerAxisFigures {
  /** Kingpin inclination σ, front-view projection, + top inboard. */
  readonly kingpinInclinationDeg: number;
  /** Caster τ, side-view projection, + top rearward. */
  readonly casterDeg: number;
  /** Lateral ground distance from the contact centre to the axis's ground point, + when that point is inboard. */
  readonly scrubRadiusMm: number;
  /** Longitudinal ground distance, + when the axis meets the ground ahead of the contact centre. */
  readonly casterTrailMm: number;
  /** Kingpin offset at the hub: lateral distance at wheel-centre height from the axis to the wheel centre, + axis inboard. */
  readonly hubOffsetMm: number;
  /** Along the spin axis, from the wheel centre to the foot of the common perpendicular with the steering axis, + when that foot is inboard. */
  readonly spindleLengthMm: number;
  /** Length of that common perpendicular (0 when spin and steering axes intersect). */
  readonly spindleOffsetMm: number;
  /** The axis's ground point (x, y, z), mm. */
  readonly groundPoint: Vec3;
}

/**
 * Steer-axis figures from the axis, the wheel centre (mm), the unit spin axis (pointing outboard) and the
 * contact centre (mm) whose height is the ground under the wheel. Definitions after SAE J670 / ISO 8855
 * terms as REFERENCES §5.1 words them; signs as DESIGN.md.
 */
export function steerAxisFigures(axis: KingpinAxis, wheelCentre: Vec3, spinAxis: Vec3, contactPatch: Vec3): SteerAxisFigures {
  const k = axis.direction;
  const ground = kingpinGroundPoint(axis, contactPatch[2]);
  const atHub = kingpinGroundPoint(axis, wheelCentre[2]);
  // Closest points of the spin axis (W + s·w) and the steering axis (P + t·k).
  const r: Vec3 = [wheelCentre[0] - axis.point[0], wheelCentre[1] - axis.point[1], wheelCentre[2] - axis.point[2]];
  const wk = spinAxis[0] * k[0] + spinAxis[1] * k[1] + spinAxis[2] * k[2];
  const wr = spinAxis[0] * r[0] + spinAxis[1] * r[1] + spinAxis[2] * r[2];
  const kr = k[0] * r[0] + k[1] * r[1] + k[2] * r[2];
  const den = 1 - wk * wk;
  const s = den > 1e-12 ? (wk * kr - wr) / den : -wr;
  const t = den > 1e-12 ? (kr - wk * wr) / den : 0;
  const gap: Vec3 = [r[0] + s * spinAxis[0] - t * k[0], r[1] + s * spinAxis[1] - t * k[1], r[2] + s * spinAxis[2] - t * k[2]];
  return {
    kingpinInclinationDeg: radToDeg(Math.atan2(-k[1], k[2])),
    casterDeg: radToDeg(Math.atan2(-k[0], k[2])),
    scrubRadiusMm: contactPatch[1] - ground[1],
    casterTrailMm: ground[0] - contactPatch[0],
    hubOffsetMm: wheelCentre[1] - atHub[1],
    spindleLengthMm: -s,
    spindleOffsetMm: Math.hypot(gap[0], gap[1], gap[2]),
    groundPoint: ground,
  };
}

/** Static spin axis of the left wheel (unit, pointing outboard) for a camber γ in degrees (+ top outboard). */
export function spinAxisFromCamberDeg(camberDeg: number): Vec3 {
  const g = degToRad(camberDeg);
  return [0, Math.cos(g), -Math.sin(g)];
}

/** The wheel after turning the knuckle about the kingpin axis (left corner). */
export interface SteeredWheel {
  /** Camber, degrees, + top outboard: −asin(w_z) of the rotated spin axis w. */
  readonly camberDeg: number;
  /** Road-wheel angle, degrees, + left: heading of the rotated forward vector, atan2(f_y, f_x). */
  readonly roadWheelAngleDeg: number;
  readonly spinAxis: Vec3;
}

/**
 * Exact steer camber and road-wheel angle (REFERENCES §5.3 [D]): rotate the spin axis w0 and the forward
 * vector f0 = (1, 0, 0) by the knuckle rotation δk (radians, + = left turn, right-hand about the upward
 * unit axis k) with Rodrigues' formula; camber = −asin(w_z), road angle = atan2(f_y, f_x).
 * For the right wheel of a symmetric car, pass the left wheel with −δk and mirror the signs of the angles.
 */
export function steeredWheel(k: Vec3, spinAxis0: Vec3, knuckleRotationRad: number): SteeredWheel {
  const w = vec3RotateAboutAxis(spinAxis0, k, knuckleRotationRad);
  const f = vec3RotateAboutAxis([1, 0, 0], k, knuckleRotationRad);
  return { camberDeg: radToDeg(-Math.asin(clampUnit(w[2]))), roadWheelAngleDeg: radToDeg(Math.atan2(f[1], f[0])), spinAxis: w };
}
