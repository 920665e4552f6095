import { GeometryError } from "../errors";
import type { PointYZ } from "../geometry-types";
import { angleNormalizeRads, degToRad, radToDeg } from "../math/angle";
import { lineIntersectionHomogeneous, type Vec2 } from "../math/vec2";
import type { Vec3 } from "../math/vec3";
import { fourBarPositionRads, type FourBarBranch, type FourBarLinks } from "./four-bar";

/** The front-view (y–z) corner of a double wishbone, left corner (y > 0), mm and degrees. */
export interface FrontViewCorner {
  readonly lowerInner: PointYZ;
  readonly lowerOuter: PointYZ;
  readonly upperInner: PointYZ;
  readonly upperOuter: PointYZ;
  readonly wheelCentre: PointYZ;
  readonly tyreRadiusMm: number;
  /** Camber at static ride height, degrees, + when the wheel top leans outboard. */
  readonly staticCamberDeg: number;
}

/**
 * The corner solved once: link lengths, the ground line, the assembly branch found from the static
 * positions, and the wheel centre in the upright's own frame. Build with frontViewModel().
 */
export interface FrontViewModel {
  readonly corner: FrontViewCorner;
  readonly links: FourBarLinks;
  readonly groundRad: number;
  readonly branch: FourBarBranch;
  readonly staticLowerArmRad: number;
  readonly staticUprightRad: number;
}

/** One solved travel position of the corner. Angles in degrees unless the name says Rad; lengths mm. */
export interface FrontViewPose {
  /** Wheel-centre vertical travel from static, mm, + bump (up relative to the body), − droop. */
  readonly travelMm: number;
  /** Lower arm angle in front view, degrees from +y (outboard), + when the outer end is higher. */
  readonly lowerArmAngleDeg: number;
  /** Upper arm angle, same convention. */
  readonly upperArmAngleDeg: number;
  /** Rotation of the upright from static about +x, radians (+ turns the upright's top inboard on the left corner). */
  readonly uprightRotationRad: number;
  readonly lowerOuter: Vec2;
  readonly upperOuter: Vec2;
  readonly wheelCentre: Vec2;
  /** Camber relative to the body, degrees, + top outboard. */
  readonly camberDeg: number;
  /** Contact centre of a rigid tyre of the given radius: wheel centre − radius along the wheel plane's up direction. */
  readonly contactPatch: Vec2;
  /** Change of track (both sides move alike in heave), mm, + wider. */
  readonly trackChangeMm: number;
  /** Front-view instant centre of the upright, or null when the arms are parallel (IC beyond 1e6 mm). */
  readonly instantCentre: Vec2 | null;
  /** Kinematic roll centre height above the ground under this wheel at this travel, mm; null when the IC lies directly above the contact patch. */
  readonly rollCentreHeightMm: number | null;
  /** dγ/dz of the wheel centre, degrees per mm of travel, relative to the body: −1/(y_wheel − y_IC) in rad/mm. */
  readonly camberGainDegPerMm: number;
}

function vecOf(p: PointYZ): Vec2 {
  return [p.y, p.z];
}

/**
 * Prepares a front-view corner: lengths, ground line (lower inner → upper inner pivot), and the branch
 * (open or crossed) that reproduces the static upper ball joint. Throws GeometryError for coincident
 * pivots or a static layout that does not close.
 */
export function frontViewModel(corner: FrontViewCorner): FrontViewModel {
  const A = vecOf(corner.lowerInner);
  const C = vecOf(corner.lowerOuter);
  const B = vecOf(corner.upperInner);
  const D = vecOf(corner.upperOuter);
  const links: FourBarLinks = {
    inputMm: Math.hypot(C[0] - A[0], C[1] - A[1]),
    couplerMm: Math.hypot(D[0] - C[0], D[1] - C[1]),
    outputMm: Math.hypot(D[0] - B[0], D[1] - B[1]),
    groundMm: Math.hypot(B[0] - A[0], B[1] - A[1]),
  };
  const named: [number, string, string][] = [
    [links.inputMm, "lower arm", "inner and outer pivots coincide"],
    [links.couplerMm, "upright", "lower and upper ball joints coincide"],
    [links.outputMm, "upper arm", "inner and outer pivots coincide"],
    [links.groundMm, "chassis", "lower and upper inner pivots coincide"],
  ];
  for (const [len, part, reason] of named) if (!(len > 1e-6)) throw new GeometryError(part, reason);
  const groundRad = Math.atan2(B[1] - A[1], B[0] - A[0]);
  const staticLowerArmRad = Math.atan2(C[1] - A[1], C[0] - A[0]);
  const staticUprightRad = Math.atan2(D[1] - C[1], D[0] - C[0]);
  const staticUpperRel = Math.atan2(D[1] - B[1], D[0] - B[0]) - groundRad;
  let best: FourBarBranch | null = null;
  let bestErr = Infinity;
  for (const branch of ["open", "crossed"] as const) {
    const sol = fourBarPositionRads(links, staticLowerArmRad - groundRad, branch);
    if (!sol) continue;
    const err = Math.abs(angleNormalizeRads(sol.outputRad - staticUpperRel));
    if (err < bestErr) {
      bestErr = err;
      best = branch;
    }
  }
  if (best === null || bestErr > 1e-6) throw new GeometryError("front suspension", "the arms and upright as drawn do not form a closed linkage");
  return { corner, links, groundRad, branch: best, staticLowerArmRad, staticUprightRad };
}

/** Upper ball joint and upright angle for lower-arm angle θ2 (radians, absolute from +y), or null if the arms cannot close. */
function uprightAt(m: FrontViewModel, lowerArmRad: number): { c: Vec2; d: Vec2; uprightRad: number } | null {
  const sol = fourBarPositionRads(m.links, lowerArmRad - m.groundRad, m.branch);
  if (!sol) return null;
  const A = m.corner.lowerInner;
  const B = m.corner.upperInner;
  const c: Vec2 = [A.y + m.links.inputMm * Math.cos(lowerArmRad), A.z + m.links.inputMm * Math.sin(lowerArmRad)];
  const outAbs = sol.outputRad + m.groundRad;
  const d: Vec2 = [B.y + m.links.outputMm * Math.cos(outAbs), B.z + m.links.outputMm * Math.sin(outAbs)];
  return { c, d, uprightRad: Math.atan2(d[1] - c[1], d[0] - c[0]) };
}

/** A point fixed in the upright, moved from its static front-view position to the pose (y, z only). */
export function frontViewUprightPoint(m: FrontViewModel, c: Vec2, rotationRad: number, p: Vec2): Vec2 {
  const c0 = m.corner.lowerOuter;
  const dy = p[0] - c0.y;
  const dz = p[1] - c0.z;
  const cs = Math.cos(rotationRad);
  const sn = Math.sin(rotationRad);
  return [c[0] + dy * cs - dz * sn, c[1] + dy * sn + dz * cs];
}

/**
 * A 3-D point fixed in the knuckle (unsteered), moved to a solved pose: the arms hinge about axes
 * parallel to x, so the knuckle turns about x by the upright rotation and x is unchanged.
 */
export function frontViewKnucklePoint(m: FrontViewModel, pose: FrontViewPose, p: Vec3): Vec3 {
  const yz = frontViewUprightPoint(m, pose.lowerOuter, pose.uprightRotationRad, [p[1], p[2]]);
  return [p[0], yz[0], yz[1]];
}

function poseFrom(m: FrontViewModel, travelMm: number, lowerArmRad: number, u: { c: Vec2; d: Vec2; uprightRad: number }, staticContactY: number): FrontViewPose {
  const corner = m.corner;
  const rot = angleNormalizeRads(u.uprightRad - m.staticUprightRad);
  const w = frontViewUprightPoint(m, u.c, rot, [corner.wheelCentre.y, corner.wheelCentre.z]);
  // Left corner seen from ahead: a positive rotation about +x tips the top inboard, lowering camber.
  const camberRad = degToRad(corner.staticCamberDeg) - rot;
  const cp: Vec2 = [w[0] - corner.tyreRadiusMm * Math.sin(camberRad), w[1] - corner.tyreRadiusMm * Math.cos(camberRad)];
  const A = vecOf(corner.lowerInner);
  const B = vecOf(corner.upperInner);
  const [X, Y, H] = lineIntersectionHomogeneous(A, u.c, B, u.d);
  const far = Math.abs(H) * 1e6 < Math.max(Math.abs(X), Math.abs(Y));
  const instantCentre: Vec2 | null = far || H === 0 ? null : [X / H, Y / H];
  // Direction from the contact patch to the IC (or along the arms when the IC is at infinity).
  const dirY = X - cp[0] * H;
  const dirZ = Y - cp[1] * H;
  const rollCentreHeightMm = Math.abs(dirY) > 1e-12 * (Math.abs(dirZ) + 1e-300) ? (-cp[0] * dirZ) / dirY : null;
  const lever = w[0] * H - X;
  const camberGainRadPerMm = lever === 0 ? 0 : -H / lever;
  return {
    travelMm,
    lowerArmAngleDeg: radToDeg(lowerArmRad),
    upperArmAngleDeg: radToDeg(Math.atan2(u.d[1] - B[1], u.d[0] - B[0])),
    uprightRotationRad: rot,
    lowerOuter: u.c,
    upperOuter: u.d,
    wheelCentre: w,
    camberDeg: radToDeg(camberRad),
    contactPatch: cp,
    trackChangeMm: 2 * (cp[0] - staticContactY),
    instantCentre,
    rollCentreHeightMm: rollCentreHeightMm === null || !Number.isFinite(rollCentreHeightMm) ? null : rollCentreHeightMm,
    camberGainDegPerMm: radToDeg(camberGainRadPerMm),
  };
}

function wheelCentreZ(m: FrontViewModel, lowerArmRad: number): number {
  const u = uprightAt(m, lowerArmRad);
  if (!u) return NaN;
  const rot = u.uprightRad - m.staticUprightRad;
  return frontViewUprightPoint(m, u.c, rot, [m.corner.wheelCentre.y, m.corner.wheelCentre.z])[1];
}

function describeTravel(travelMm: number): string {
  return travelMm >= 0 ? `${travelMm.toFixed(2)} mm of bump` : `${(-travelMm).toFixed(2)} mm of droop`;
}

/**
 * Solves the corner at a wheel-centre travel (mm, + bump): finds the lower-arm angle whose wheel centre
 * sits travelMm above static (Newton's method on the closed-form four-bar, from `guessLowerArmRad`).
 * Throws GeometryError("front suspension", "arms cannot close at … mm of bump") when no assembly exists.
 */
export function frontViewPoseAtTravel(m: FrontViewModel, travelMm: number, guessLowerArmRad = m.staticLowerArmRad): FrontViewPose {
  const target = m.corner.wheelCentre.z + travelMm;
  let theta = guessLowerArmRad;
  let g = wheelCentreZ(m, theta) - target;
  // Newton's method with one numeric derivative, then secant updates of the slope (one solve per step).
  const step = 1e-7;
  let slope = NaN;
  for (let iter = 0; iter < 60 && Number.isFinite(g) && Math.abs(g) > 1e-11; iter++) {
    if (!Number.isFinite(slope) || slope === 0) {
      let gp = wheelCentreZ(m, theta + step) - target;
      let h = step;
      if (!Number.isFinite(gp)) {
        h = -step;
        gp = wheelCentreZ(m, theta - step) - target;
      }
      slope = (gp - g) / h;
      if (!Number.isFinite(slope) || slope === 0) break;
    }
    let delta = -g / slope;
    // Cap a step at 0.2 rad and halve it until the linkage still closes.
    if (Math.abs(delta) > 0.2) delta = Math.sign(delta) * 0.2;
    let next = NaN;
    for (let k = 0; k < 30; k++) {
      next = wheelCentreZ(m, theta + delta) - target;
      if (Number.isFinite(next)) break;
      delta /= 2;
    }
    if (!Number.isFinite(next)) break;
    slope = (next - g) / delta;
    theta += delta;
    g = next;
  }
  const u = Number.isFinite(g) && Math.abs(g) <= 1e-8 ? uprightAt(m, theta) : null;
  if (!u) throw new GeometryError("front suspension", `arms cannot close at ${describeTravel(travelMm)} (the upright cannot reach that height)`);
  const staticCpY = m.corner.wheelCentre.y - m.corner.tyreRadiusMm * Math.sin(degToRad(m.corner.staticCamberDeg));
  return poseFrom(m, travelMm, angleNormalizeRads(theta), u, staticCpY);
}

/** Equally spaced travels from −droopMm to +bumpMm (steps ≥ 2), mm. */
export function travelSteps(bumpMm: number, droopMm: number, steps: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < steps; i++) out.push(-droopMm + ((bumpMm + droopMm) * i) / (steps - 1));
  return out;
}

/**
 * Solves the corner at each travel (mm, + bump), continuing outward from the position nearest static so
 * each solve starts next to its answer. Throws GeometryError naming the first travel that cannot close.
 */
export function frontViewSweep(m: FrontViewModel, travelsMm: readonly number[]): FrontViewPose[] {
  const n = travelsMm.length;
  const poses: FrontViewPose[] = new Array(n);
  let i0 = 0;
  for (let i = 1; i < n; i++) if (Math.abs(travelsMm[i]) < Math.abs(travelsMm[i0])) i0 = i;
  if (n === 0) return poses;
  poses[i0] = frontViewPoseAtTravel(m, travelsMm[i0]);
  for (let i = i0 + 1; i < n; i++) poses[i] = frontViewPoseAtTravel(m, travelsMm[i], degToRad(poses[i - 1].lowerArmAngleDeg));
  for (let i = i0 - 1; i >= 0; i--) poses[i] = frontViewPoseAtTravel(m, travelsMm[i], degToRad(poses[i + 1].lowerArmAngleDeg));
  return poses;
}
