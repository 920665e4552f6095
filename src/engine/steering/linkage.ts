import { GeometryError } from "../errors";
import { angleNormalizeRads, clampUnit } from "../math/angle";
import type { Vec3 } from "../math/vec3";
import type { KingpinAxis } from "./steer-axis";

/**
 * The circle the steering arm ball sweeps as the knuckle turns about the kingpin axis: centre on the
 * axis, radial vector u from the centre to the ball at zero knuckle rotation, tangent v = k × u (same
 * length), axis k (unit, up). Ball(φ) = centre + u·cos φ + v·sin φ, φ = knuckle rotation (radians,
 * right-hand about k: + turns the left wheel to the left). Vehicle frame, mm.
 */
export interface ArmBallCircle {
  readonly centre: Vec3;
  readonly radial: Vec3;
  readonly tangent: Vec3;
  readonly axis: Vec3;
}

/** The arm-ball circle of a ball fixed to the knuckle about a kingpin axis. Throws if the ball lies on the axis. */
export function armBallCircle(axis: KingpinAxis, armBall: Vec3): ArmBallCircle {
  const k = axis.direction;
  const r: Vec3 = [armBall[0] - axis.point[0], armBall[1] - axis.point[1], armBall[2] - axis.point[2]];
  const t = r[0] * k[0] + r[1] * k[1] + r[2] * k[2];
  const centre: Vec3 = [axis.point[0] + t * k[0], axis.point[1] + t * k[1], axis.point[2] + t * k[2]];
  const u: Vec3 = [armBall[0] - centre[0], armBall[1] - centre[1], armBall[2] - centre[2]];
  if (!(Math.hypot(u[0], u[1], u[2]) > 1e-6)) throw new GeometryError("steering arm", "the arm ball lies on the kingpin axis, so it cannot steer the wheel");
  const v: Vec3 = [k[1] * u[2] - k[2] * u[1], k[2] * u[0] - k[0] * u[2], k[0] * u[1] - k[1] * u[0]];
  return { centre, radial: u, tangent: v, axis: k };
}

/** Arm ball position at knuckle rotation φ (radians), mm. */
export function armBallAt(c: ArmBallCircle, rotationRad: number): Vec3 {
  const cs = Math.cos(rotationRad);
  const sn = Math.sin(rotationRad);
  return [
    c.centre[0] + c.radial[0] * cs + c.tangent[0] * sn,
    c.centre[1] + c.radial[1] * cs + c.tangent[1] * sn,
    c.centre[2] + c.radial[2] * cs + c.tangent[2] * sn,
  ];
}

/**
 * Tie-rod closure written as A·cos φ + B·sin φ = C for a fixed inner ball Q and tie-rod length l:
 * A = 2(centre − Q)·u, B = 2(centre − Q)·v, C = l² − |u|² − |centre − Q|² (expanding |Ball(φ) − Q|² = l²).
 * Solutions φ = atan2(B, A) ∓ acos(C/√(A² + B²)); none when |C| > √(A² + B²) (the rod cannot reach).
 */
export interface TieRodClosure {
  readonly a: number;
  readonly b: number;
  readonly c: number;
}

/** Closure coefficients (mm²) for inner ball Q and tie-rod length l (mm). */
export function tieRodClosure(circle: ArmBallCircle, innerBall: Vec3, tieRodLengthMm: number): TieRodClosure {
  const e: Vec3 = [circle.centre[0] - innerBall[0], circle.centre[1] - innerBall[1], circle.centre[2] - innerBall[2]];
  const u = circle.radial;
  const v = circle.tangent;
  const rr = u[0] * u[0] + u[1] * u[1] + u[2] * u[2];
  const ee = e[0] * e[0] + e[1] * e[1] + e[2] * e[2];
  return {
    a: 2 * (e[0] * u[0] + e[1] * u[1] + e[2] * u[2]),
    b: 2 * (e[0] * v[0] + e[1] * v[1] + e[2] * v[2]),
    c: tieRodLengthMm * tieRodLengthMm - rr - ee,
  };
}

/**
 * Assembly branch (+1 or −1) that puts the knuckle at φ = 0 for the inner ball where the tie rod was
 * drawn (the static layout): the sign of B there. Throws when the tie rod is in line with the arm
 * (toggle at straight ahead), where no branch is defined.
 */
export function tieRodBranch(closure: TieRodClosure): 1 | -1 {
  const rho = Math.hypot(closure.a, closure.b);
  if (!(Math.abs(closure.b) > 1e-9 * (rho + 1))) {
    throw new GeometryError("tie rod", "the tie rod is in line with the steering arm at straight ahead (toggle): it cannot steer");
  }
  return closure.b > 0 ? 1 : -1;
}

/**
 * Knuckle rotation (radians, + left, right-hand about the upward kingpin axis) that closes the tie rod:
 * φ = atan2(B, A) − branch·acos(C/√(A² + B²)), wrapped into (−π, π]. Returns null when the tie rod
 * cannot reach the steering arm.
 */
export function knuckleRotationForClosureRads(closure: TieRodClosure, branch: 1 | -1): number | null {
  const rho = Math.hypot(closure.a, closure.b);
  if (!(rho > 0) || Math.abs(closure.c) > rho * (1 + 1e-14)) return null;
  return angleNormalizeRads(Math.atan2(closure.b, closure.a) - branch * Math.acos(clampUnit(closure.c / rho)));
}

/**
 * A rack-driven corner at one suspension pose, ready for fast solves: the closure coefficients are
 * linear/quadratic in the rack displacement s (mm, + = rack end moves to +y):
 * A(s) = a0 + aS·s, B(s) = b0 + bS·s, C(s) = c0 + cS·s − s².
 */
export interface RackLinkage {
  readonly a0: number;
  readonly aS: number;
  readonly b0: number;
  readonly bS: number;
  readonly c0: number;
  readonly cS: number;
  readonly branch: 1 | -1;
}

/** Builds the rack linkage for an arm-ball circle, the rack end at centre rack, a tie-rod length (mm) and a branch. */
export function rackLinkage(circle: ArmBallCircle, rackEnd: Vec3, tieRodLengthMm: number, branch: 1 | -1): RackLinkage {
  const base = tieRodClosure(circle, rackEnd, tieRodLengthMm);
  const e1 = circle.centre[1] - rackEnd[1];
  return { a0: base.a, aS: -2 * circle.radial[1], b0: base.b, bS: -2 * circle.tangent[1], c0: base.c, cS: 2 * e1, branch };
}

/** Closure coefficients of a rack linkage at rack displacement s (mm). */
export function rackClosureAt(l: RackLinkage, rackMm: number): TieRodClosure {
  return { a: l.a0 + l.aS * rackMm, b: l.b0 + l.bS * rackMm, c: l.c0 + l.cS * rackMm - rackMm * rackMm };
}

/** Reach margin A² + B² − C² (mm⁴) at rack displacement s: ≥ 0 where the tie rod reaches, 0 at toggle. */
export function rackReachMargin(l: RackLinkage, rackMm: number): number {
  const a = l.a0 + l.aS * rackMm;
  const b = l.b0 + l.bS * rackMm;
  const c = l.c0 + l.cS * rackMm - rackMm * rackMm;
  return a * a + b * b - c * c;
}

/** Knuckle rotation (radians, + left) at rack displacement s (mm), or null where the tie rod cannot reach. */
export function knuckleRotationForRackRads(l: RackLinkage, rackMm: number): number | null {
  return knuckleRotationForClosureRads(rackClosureAt(l, rackMm), l.branch);
}
