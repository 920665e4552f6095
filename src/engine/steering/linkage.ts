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

/** The two kinds of steering input: a rack (position in mm along y) or a bellcrank (angle in degrees about a vertical pivot). */
export type SteerInputKind = "rack" | "bellcrank";

/**
 * A steered corner at one suspension pose, ready for fast solves at steering-input position q (rack mm,
 * + = rack end moves to +y; or bellcrank degrees, + = counter-clockwise seen from above). The tie-rod
 * closure's coefficients are linear in two basis functions of q (see inputBasis):
 * X(q) = x0 + x1·p1(q) + x2·p2(q) for X = A, B, C.
 * Rack: (p1, p2) = (s, s²). Bellcrank: (p1, p2) = (cos θ − 1, sin θ).
 */
export interface InputLinkage {
  readonly kind: SteerInputKind;
  readonly a0: number;
  readonly a1: number;
  readonly a2: number;
  readonly b0: number;
  readonly b1: number;
  readonly b2: number;
  readonly c0: number;
  readonly c1: number;
  readonly c2: number;
  readonly branch: 1 | -1;
}

/** The basis (p1, p2) of a steering input at q: rack (s, s²) with s in mm; bellcrank (cos θ − 1, sin θ) with θ = q degrees. */
export function inputBasis(kind: SteerInputKind, q: number): readonly [number, number] {
  if (kind === "rack") return [q, q * q];
  const t = (q * Math.PI) / 180;
  return [Math.cos(t) - 1, Math.sin(t)];
}

/**
 * A rack: the tie-rod inner ball at rackEnd + s·ŷ. Expanding |Ball(φ) − Q(s)|² = l² with e = centre − Q(0):
 * A = A0 − 2s·u_y, B = B0 − 2s·v_y, C = C0 + 2s·e_y − s².
 */
export function rackLinkage(circle: ArmBallCircle, rackEnd: Vec3, tieRodLengthMm: number, branch: 1 | -1): InputLinkage {
  const base = tieRodClosure(circle, rackEnd, tieRodLengthMm);
  const e1 = circle.centre[1] - rackEnd[1];
  return { kind: "rack", a0: base.a, a1: -2 * circle.radial[1], a2: 0, b0: base.b, b1: -2 * circle.tangent[1], b2: 0, c0: base.c, c1: 2 * e1, c2: -1, branch };
}

/**
 * A bellcrank turning about a vertical axis through `pivot`: the tie-rod inner ball at
 * Q(θ) = Q0 + (cos θ − 1)·r + sin θ·t, where r is the horizontal arm from the pivot to Q0 and t = ẑ × r
 * (same length ρ). With e0 = centre − Q0, and because r ⊥ t, |(cos θ − 1)r + sin θ t|² = −2(cos θ − 1)ρ²:
 * A = A0 − 2p1 r·u − 2p2 t·u, B likewise with v, C = C0 + 2p1 (e0·r + ρ²) + 2p2 e0·t.
 * Throws when the inner ball sits on the pivot's axis (no arm to turn it).
 */
export function bellcrankLinkage(circle: ArmBallCircle, innerBall: Vec3, pivot: Vec3, tieRodLengthMm: number, branch: 1 | -1): InputLinkage {
  const base = tieRodClosure(circle, innerBall, tieRodLengthMm);
  const r: Vec3 = [innerBall[0] - pivot[0], innerBall[1] - pivot[1], 0];
  const rho2 = r[0] * r[0] + r[1] * r[1];
  if (!(rho2 > 1e-6)) throw new GeometryError("bellcrank", "the tie-rod inner ball sits on the bellcrank pivot's axis: the bellcrank arm has no length");
  const t: Vec3 = [-r[1], r[0], 0];
  const e0: Vec3 = [circle.centre[0] - innerBall[0], circle.centre[1] - innerBall[1], circle.centre[2] - innerBall[2]];
  const dot = (p: Vec3, q: Vec3) => p[0] * q[0] + p[1] * q[1] + p[2] * q[2];
  const u = circle.radial;
  const v = circle.tangent;
  return {
    kind: "bellcrank",
    a0: base.a,
    a1: -2 * dot(r, u),
    a2: -2 * dot(t, u),
    b0: base.b,
    b1: -2 * dot(r, v),
    b2: -2 * dot(t, v),
    c0: base.c,
    c1: 2 * (dot(e0, r) + rho2),
    c2: 2 * dot(e0, t),
    branch,
  };
}

/** Where the tie-rod inner ball is at input q (rack mm, bellcrank degrees), for drawing and checks. */
export function innerBallAt(kind: SteerInputKind, innerBall: Vec3, pivot: Vec3 | null, q: number): Vec3 {
  if (kind === "rack" || !pivot) return [innerBall[0], innerBall[1] + q, innerBall[2]];
  const rx = innerBall[0] - pivot[0];
  const ry = innerBall[1] - pivot[1];
  const c = Math.cos((q * Math.PI) / 180);
  const s = Math.sin((q * Math.PI) / 180);
  return [pivot[0] + rx * c - ry * s, pivot[1] + rx * s + ry * c, innerBall[2]];
}

/** Closure coefficients of an input linkage at input q (rack mm, bellcrank degrees). */
export function inputClosureAt(l: InputLinkage, q: number): TieRodClosure {
  const [p1, p2] = inputBasis(l.kind, q);
  return { a: l.a0 + l.a1 * p1 + l.a2 * p2, b: l.b0 + l.b1 * p1 + l.b2 * p2, c: l.c0 + l.c1 * p1 + l.c2 * p2 };
}

/** Closure coefficients of a rack linkage at rack displacement s (mm). */
export function rackClosureAt(l: InputLinkage, rackMm: number): TieRodClosure {
  return inputClosureAt(l, rackMm);
}

/**
 * Reach margin A² + B² − C² (mm⁴) at input q: ≥ 0 where the tie rod reaches, 0 at toggle (the tie rod in
 * line with the steering arm: the input can go no further), < 0 past it.
 */
export function inputReachMargin(l: InputLinkage, q: number): number {
  const { a, b, c } = inputClosureAt(l, q);
  return a * a + b * b - c * c;
}

/** Reach margin at rack displacement s (mm); see inputReachMargin. */
export function rackReachMargin(l: InputLinkage, rackMm: number): number {
  return inputReachMargin(l, rackMm);
}

/** Knuckle rotation (radians, + left) at input q, or null where the tie rod cannot reach. */
export function knuckleRotationForInputRads(l: InputLinkage, q: number): number | null {
  return knuckleRotationForClosureRads(inputClosureAt(l, q), l.branch);
}

/** Knuckle rotation (radians, + left) at rack displacement s (mm), or null where the tie rod cannot reach. */
export function knuckleRotationForRackRads(l: InputLinkage, rackMm: number): number | null {
  return knuckleRotationForInputRads(l, rackMm);
}
