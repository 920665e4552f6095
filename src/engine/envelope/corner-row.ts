/**
 * One travel pose of the left corner prepared for fast steering solves, and the point solver the envelope,
 * the steer lock and the steering stop all share: knuckle rotation from the tie-rod closure at an input
 * position, then the steered spin axis and outboard joint by Rodrigues' rotation, the drive joint's
 * operating angle, the road-wheel angle and the shaft length. Vehicle frame (ISO 8855), mm, radians inside.
 */
import { staticTieRodLengthMm, steerInputLinkage, type StaticPoints } from "../corner-points";
import { radToDeg } from "../math/angle";
import { vec3RotateX } from "../math/rotation";
import type { Vec3 } from "../math/vec3";
import { armBallCircle, inputBasis, tieRodBranch, tieRodClosure, type InputLinkage, type SteerInputKind } from "../steering/linkage";
import type { KingpinAxis } from "../steering/steer-axis";
import { frontViewKnucklePoint, frontViewPoseAtTravel, type FrontViewModel, type FrontViewPose } from "../suspension/front-view";

/**
 * One travel pose: the tie-rod closure's coefficients, the kingpin axis, and the Rodrigues terms
 * (v, k × v, k·v) of the spin axis and of the outboard joint centre.
 */
export interface CornerRow {
  readonly travelMm: number;
  readonly pose: FrontViewPose;
  readonly axis: KingpinAxis;
  readonly lk: InputLinkage;
  readonly kx: number;
  readonly ky: number;
  readonly kz: number;
  readonly wx: number;
  readonly wy: number;
  readonly wz: number;
  readonly cwx: number;
  readonly cwy: number;
  readonly cwz: number;
  readonly kw: number;
  readonly rx: number;
  readonly ry: number;
  readonly rz: number;
  readonly crx: number;
  readonly cry: number;
  readonly crz: number;
  readonly kr: number;
}

/** Scratch filled by evalPoint (one object reused, so the grid loop allocates nothing per point). */
export interface PointScratch {
  knuckleRad: number;
  jointDeg: number;
  roadDeg: number;
  spinZ: number;
  shaftMm: number;
}

export const newScratch = (): PointScratch => ({ knuckleRad: 0, jointDeg: 0, roadDeg: 0, spinZ: 0, shaftMm: 0 });

/** The inboard joint centre (fixed to the chassis), mm. */
export interface Context {
  readonly ix: number;
  readonly iy: number;
  readonly iz: number;
}

/** What every row of one layout shares: the front-view model, the static points, the tie rod and its branch. */
export interface CornerModel {
  readonly fv: FrontViewModel;
  readonly pts: StaticPoints;
  readonly tieRodMm: number;
  readonly branch: 1 | -1;
  readonly ctx: Context;
  readonly kind: SteerInputKind;
}

export function cornerModel(fv: FrontViewModel, pts: StaticPoints): CornerModel {
  const tieRodMm = staticTieRodLengthMm(pts);
  const branch = tieRodBranch(tieRodClosure(armBallCircle(pts.axis, pts.armBall), pts.tieRodInner, tieRodMm));
  return { fv, pts, tieRodMm, branch, ctx: { ix: pts.inboardJoint[0], iy: pts.inboardJoint[1], iz: pts.inboardJoint[2] }, kind: pts.input.kind };
}

export function cornerRow(m: CornerModel, pose: FrontViewPose): CornerRow {
  const { fv, pts } = m;
  const rot = pose.uprightRotationRad;
  const axisPoint = frontViewKnucklePoint(fv, pose, pts.axis.point);
  const k = vec3RotateX(pts.axis.direction, rot);
  const axis: KingpinAxis = { point: axisPoint, direction: k };
  const circle = armBallCircle(axis, frontViewKnucklePoint(fv, pose, pts.armBall));
  const lk = steerInputLinkage(pts, circle, m.tieRodMm, m.branch);
  const w = vec3RotateX(pts.spinAxis, rot);
  const o = frontViewKnucklePoint(fv, pose, pts.outboardJoint);
  const r: Vec3 = [o[0] - axisPoint[0], o[1] - axisPoint[1], o[2] - axisPoint[2]];
  const [kx, ky, kz] = k;
  return {
    travelMm: pose.travelMm,
    pose,
    axis,
    lk,
    kx,
    ky,
    kz,
    wx: w[0],
    wy: w[1],
    wz: w[2],
    cwx: ky * w[2] - kz * w[1],
    cwy: kz * w[0] - kx * w[2],
    cwz: kx * w[1] - ky * w[0],
    kw: kx * w[0] + ky * w[1] + kz * w[2],
    rx: r[0],
    ry: r[1],
    rz: r[2],
    crx: ky * r[2] - kz * r[1],
    cry: kz * r[0] - kx * r[2],
    crz: kx * r[1] - ky * r[0],
    kr: kx * r[0] + ky * r[1] + kz * r[2],
  };
}

/** The row at any travel (mm, + bump); throws GeometryError where the arms cannot close. */
export function cornerRowAtTravel(m: CornerModel, travelMm: number): CornerRow {
  return cornerRow(m, frontViewPoseAtTravel(m.fv, travelMm));
}

/**
 * Solves one input position given by its basis values (p1, p2) (see inputBasis) on one travel row (left
 * wheel). Returns false where the tie rod cannot reach.
 */
export function evalPointBasis(row: CornerRow, p1: number, p2: number, ctx: Context, out: PointScratch): boolean {
  const lk = row.lk;
  const a = lk.a0 + lk.a1 * p1 + lk.a2 * p2;
  const b = lk.b0 + lk.b1 * p1 + lk.b2 * p2;
  const c = lk.c0 + lk.c1 * p1 + lk.c2 * p2;
  const rho2 = a * a + b * b;
  if (c * c > rho2 * (1 + 1e-14) || rho2 === 0) return false;
  const rho = Math.sqrt(rho2);
  let q = c / rho;
  if (q > 1) q = 1;
  else if (q < -1) q = -1;
  let phi = Math.atan2(b, a) - lk.branch * Math.acos(q);
  if (phi > Math.PI) phi -= 2 * Math.PI;
  else if (phi <= -Math.PI) phi += 2 * Math.PI;
  const cs = Math.cos(phi);
  const sn = Math.sin(phi);
  const t = 1 - cs;
  const kwT = row.kw * t;
  const wx = row.wx * cs + row.cwx * sn + row.kx * kwT;
  const wy = row.wy * cs + row.cwy * sn + row.ky * kwT;
  const wz = row.wz * cs + row.cwz * sn + row.kz * kwT;
  const krT = row.kr * t;
  const sx = row.axis.point[0] + row.rx * cs + row.crx * sn + row.kx * krT - ctx.ix;
  const sy = row.axis.point[1] + row.ry * cs + row.cry * sn + row.ky * krT - ctx.iy;
  const sz = row.axis.point[2] + row.rz * cs + row.crz * sn + row.kz * krT - ctx.iz;
  out.knuckleRad = phi;
  // The drive joint's operating angle exactly as drive/joint-angle.ts defines it, atan2(|s × w|, s·w),
  // written out here so the grid loop allocates nothing (tests check it against jointOperatingAngleDeg).
  const cx = sy * wz - sz * wy;
  const cy = sz * wx - sx * wz;
  const cz = sx * wy - sy * wx;
  out.jointDeg = radToDeg(Math.atan2(Math.sqrt(cx * cx + cy * cy + cz * cz), sx * wx + sy * wy + sz * wz));
  // Forward vector f0 = (1, 0, 0) rotated: f = f0·cos φ + (k × f0)·sin φ + k·kx·(1 − cos φ).
  out.roadDeg = radToDeg(Math.atan2(row.kz * sn + row.ky * row.kx * t, cs + row.kx * row.kx * t));
  out.spinZ = wz;
  out.shaftMm = Math.sqrt(sx * sx + sy * sy + sz * sz);
  return true;
}

/** Solves one input position q (rack mm or bellcrank degrees) on one row; false where the tie rod cannot reach. */
export function evalPoint(row: CornerRow, q: number, ctx: Context, out: PointScratch): boolean {
  // inputBasis written out, so a search calling this many times allocates nothing.
  if (row.lk.kind === "rack") return evalPointBasis(row, q, q * q, ctx, out);
  const t = (q * Math.PI) / 180;
  return evalPointBasis(row, Math.cos(t) - 1, Math.sin(t), ctx, out);
}

/** The input grid: positions from −travel to +travel and their basis values (computed once for all rows). */
export interface InputGrid {
  readonly values: Float64Array;
  readonly p1: Float64Array;
  readonly p2: Float64Array;
}

export function inputGrid(kind: SteerInputKind, travel: number, n: number): InputGrid {
  const values = new Float64Array(n);
  const p1 = new Float64Array(n);
  const p2 = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    values[j] = -travel + (2 * travel * j) / (n - 1);
    const [a, b] = inputBasis(kind, values[j]);
    p1[j] = a;
    p2[j] = b;
  }
  return { values, p1, p2 };
}

/** Per-row grid values, NaN where the tie rod cannot reach (internal only; output uses null). */
export interface RowGrid {
  readonly joint: Float64Array;
  readonly road: Float64Array;
  readonly spinZ: Float64Array;
  readonly knuckle: Float64Array;
  readonly shaft: Float64Array;
}

export function rowGridBuffers(n: number): RowGrid {
  return { joint: new Float64Array(n), road: new Float64Array(n), spinZ: new Float64Array(n), knuckle: new Float64Array(n), shaft: new Float64Array(n) };
}

/** Fills g (reused from row to row) with the row's values at every input sample. */
export function rowGrid(row: CornerRow, grid: InputGrid, ctx: Context, scratch: PointScratch, g: RowGrid): RowGrid {
  const n = grid.values.length;
  for (let j = 0; j < n; j++) {
    if (evalPointBasis(row, grid.p1[j], grid.p2[j], ctx, scratch)) {
      g.joint[j] = scratch.jointDeg;
      g.road[j] = scratch.roadDeg;
      g.spinZ[j] = scratch.spinZ;
      g.knuckle[j] = scratch.knuckleRad;
      g.shaft[j] = scratch.shaftMm;
    } else {
      g.joint[j] = NaN;
      g.road[j] = NaN;
      g.spinZ[j] = NaN;
      g.knuckle[j] = NaN;
      g.shaft[j] = NaN;
    }
  }
  return g;
}

/** "static ride height", "4.0 mm of bump", "2.0 mm of droop": a travel in words for messages. */
export function describeTravel(travelMm: number): string {
  if (Math.abs(travelMm) < 1e-9) return "static ride height";
  return travelMm > 0 ? `${travelMm.toFixed(1)} mm of bump` : `${(-travelMm).toFixed(1)} mm of droop`;
}
