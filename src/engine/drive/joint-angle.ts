/**
 * Operating angle of the outboard drive joint: the bend between the shaft axis and the stub axle.
 * Frame: vehicle axes (ISO 8855, x forward, y left, z up); angles in degrees, 0 = shaft in line with the stub axle.
 */
import { GeometryError } from "../errors";
import type { Vec3 } from "../math/vec3";
import { DEG_PER_RAD, RAD_PER_DEG, requireFinite } from "./guards";

const JOINT = "drive joint";

function checkedDirection(v: Vec3, part: string): Vec3 {
  if (!Array.isArray(v) || v.length !== 3) throw new GeometryError(part, "direction must be three numbers");
  v.forEach((c, i) => requireFinite(c, part, `direction component ${"xyz"[i]}`));
  if (Math.hypot(v[0], v[1], v[2]) === 0) throw new GeometryError(part, "direction has zero length");
  return v;
}

/**
 * Angle between the shaft axis (inboard joint centre → outboard joint centre) and the stub axle direction
 * (pointing outboard, away from the knuckle), degrees, in [0°, 180°]; neither vector needs to be unit length.
 * Computed as atan2(|s × w|, s·w), accurate at small and near-180° angles alike.
 * Throws GeometryError ("drive shaft" / "stub axle") for a zero-length or non-finite direction.
 */
export function jointOperatingAngleDeg(shaftDir: Vec3, stubAxleDir: Vec3): number {
  const [sx, sy, sz] = checkedDirection(shaftDir, "drive shaft");
  const [wx, wy, wz] = checkedDirection(stubAxleDir, "stub axle");
  const cross = Math.hypot(sy * wz - sz * wy, sz * wx - sx * wz, sx * wy - sy * wx);
  const dot = sx * wx + sy * wy + sz * wz;
  return Math.atan2(cross, dot) * DEG_PER_RAD;
}

/**
 * Joint angle of the idealised corner (REFERENCES §1.5 [D]): joint centre on the steering axis, stub axle
 * horizontal and steered by δ in top view, shaft inclined by α in front view: cos β = cos α · cos δ.
 * α (shaft inclination, + outer end up or down alike) in [−90°, 90°], δ (road-wheel steer, left +) in
 * [−180°, 180°]; returns β in degrees, [0°, 180°]. Throws GeometryError outside those ranges.
 */
export function jointAngleFromInclinationAndSteerDeg(alphaDeg: number, deltaDeg: number): number {
  const alpha = checkedInclinationRad(alphaDeg);
  const delta = requireFinite(deltaDeg, JOINT, "steer angle") * RAD_PER_DEG;
  if (Math.abs(delta) > Math.PI) throw new GeometryError(JOINT, `steer angle ${deltaDeg}° is beyond ±180°`);
  // Dot product of the shaft (0, cos α, sin α) and the stub axle (−sin δ, cos δ, 0), taken through the robust form.
  return jointOperatingAngleDeg([0, Math.cos(alpha), Math.sin(alpha)], [-Math.sin(delta), Math.cos(delta), 0]);
}

function checkedInclinationRad(alphaDeg: number): number {
  const alpha = requireFinite(alphaDeg, JOINT, "shaft inclination") * RAD_PER_DEG;
  if (Math.abs(alpha) >= Math.PI / 2) throw new GeometryError(JOINT, `shaft inclination ${alphaDeg}° must be within ±90°`);
  return alpha;
}

/**
 * Steer angle at which the idealised joint (as jointAngleFromInclinationAndSteerDeg) reaches operating angle β:
 * δ = arccos(cos β / cos α), degrees, in [0°, 180°] (the same magnitude applies to either steer direction).
 * α in (−90°, 90°), β in [0°, 180°]. Throws GeometryError ("drive joint") when β < |α|, since the joint already
 * exceeds β at straight ahead.
 */
export function steerForJointAngleDeg(alphaDeg: number, betaDeg: number): number {
  const alpha = checkedInclinationRad(alphaDeg);
  const beta = requireFinite(betaDeg, JOINT, "joint angle") * RAD_PER_DEG;
  if (beta < 0 || beta > Math.PI) throw new GeometryError(JOINT, `joint angle ${betaDeg}° must lie in 0°…180°`);
  const ratio = Math.cos(beta) / Math.cos(alpha);
  // Allow a rounding sliver at β = |α| (straight ahead), but no more.
  if (ratio > 1 + 1e-12) {
    throw new GeometryError(
      JOINT,
      `joint angle ${betaDeg}° is below the shaft inclination ${Math.abs(alphaDeg)}° at straight ahead: no steer reaches it`,
    );
  }
  return Math.acos(Math.min(1, Math.max(-1, ratio))) * DEG_PER_RAD;
}
