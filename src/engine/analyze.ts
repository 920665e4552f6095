/**
 * One full analysis of a kit layout: front-view sweep over travel, steering at static ride height,
 * the steer × travel envelope of the drive joint with steer lock at every travel, steer-axis figures,
 * Ackermann and shaft strength. Pure and synchronous; throws GeometryError for impossible input.
 */
import type { AnalysisResult, SteerLimitReason, SteerLockResult, SteerStepResult, TravelStepResult } from "./analysis-result";
import { cardanSpeedFluctuation } from "./drive/cardan";
import { DRIVE_JOINT_TYPES } from "./drive/joint-types";
import { jointOperatingAngleDeg } from "./drive/joint-angle";
import { cupArticulationLimit, type CupMouth } from "./drive/neck-contact";
import { GeometryError } from "./errors";
import { staticPoints, staticTieRodLengthMm, type StaticPoints } from "./corner-points";
import type { KitLayout, KitMaterial } from "./kit-layout";
import { radToDeg } from "./math/angle";
import { vec3RotateX } from "./math/rotation";
import { rootBracketIllinois } from "./math/root-find";
import type { Vec3 } from "./math/vec3";
import { ackermannInnerReferencePercent, ackermannOuterReferencePercent, ackermannTurnCentrePercent } from "./steering/ackermann";
import { armBallCircle, rackLinkage, tieRodBranch, tieRodClosure, type RackLinkage } from "./steering/linkage";
import { steerAxisFigures, type KingpinAxis } from "./steering/steer-axis";
import { analyzeStrength, materialById, type MaterialFigure, type StrengthResult } from "./strength/index";
import { frontViewKnucklePoint, frontViewModel, frontViewPoseAtTravel, frontViewSweep, travelSteps, type FrontViewModel, type FrontViewPose } from "./suspension/front-view";

/** Grid resolution. Bounds keep one analysis's cost fixed whatever a caller asks for. */
export interface AnalyzeOptions {
  /** Travel steps from full droop to full bump, 2–201 (default 21). */
  readonly travelSteps?: number;
  /** Rack steps from full one way to full the other, 3–301 (default 41; odd puts one on centre). */
  readonly steerSteps?: number;
}

export const ANALYZE_LIMITS = { travelSteps: { min: 2, max: 201, default: 21 }, steerSteps: { min: 3, max: 301, default: 41 } } as const;

/** Angle at which the Ackermann figures are reported as null (0/0 near straight ahead), degrees. */
const ACKERMANN_MIN_ANGLE_DEG = 0.5;

function checkedSteps(value: number | undefined, key: keyof typeof ANALYZE_LIMITS): number {
  const lim = ANALYZE_LIMITS[key];
  const n = value ?? lim.default;
  if (!Number.isInteger(n) || n < lim.min || n > lim.max) {
    throw new GeometryError("analysis grid", `${key} must be a whole number from ${lim.min} to ${lim.max} (got ${String(value)})`);
  }
  return n;
}

/**
 * One travel pose prepared for fast steer solves: the tie-rod closure's coefficients, the kingpin axis,
 * and the Rodrigues terms (v, k × v, k·v) of the spin axis and of the outboard joint centre.
 */
interface CornerRow {
  readonly travelMm: number;
  readonly pose: FrontViewPose;
  readonly axis: KingpinAxis;
  readonly lk: RackLinkage;
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
interface PointScratch {
  knuckleRad: number;
  jointDeg: number;
  roadDeg: number;
  spinZ: number;
  shaftMm: number;
}

interface Context {
  readonly ix: number;
  readonly iy: number;
  readonly iz: number;
}

function cornerRow(m: FrontViewModel, pose: FrontViewPose, pts: StaticPoints, tieRodMm: number, branch: 1 | -1): CornerRow {
  const rot = pose.uprightRotationRad;
  const axisPoint = frontViewKnucklePoint(m, pose, pts.axis.point);
  const k = vec3RotateX(pts.axis.direction, rot);
  const axis: KingpinAxis = { point: axisPoint, direction: k };
  const circle = armBallCircle(axis, frontViewKnucklePoint(m, pose, pts.armBall));
  const lk = rackLinkage(circle, pts.rackEnd, tieRodMm, branch);
  const w = vec3RotateX(pts.spinAxis, rot);
  const o = frontViewKnucklePoint(m, pose, pts.outboardJoint);
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

/**
 * Solves one rack position on one travel row (left wheel): knuckle rotation from the tie-rod closure,
 * then the steered spin axis and outboard joint by Rodrigues, the joint angle, road-wheel angle and
 * shaft length. Returns false where the tie rod cannot reach.
 */
function evalPoint(row: CornerRow, rackMm: number, ctx: Context, out: PointScratch): boolean {
  const lk = row.lk;
  const a = lk.a0 + lk.aS * rackMm;
  const b = lk.b0 + lk.bS * rackMm;
  const c = lk.c0 + lk.cS * rackMm - rackMm * rackMm;
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

function describeTravel(travelMm: number): string {
  if (Math.abs(travelMm) < 1e-9) return "static ride height";
  return travelMm > 0 ? `${travelMm.toFixed(1)} mm of bump` : `${(-travelMm).toFixed(1)} mm of droop`;
}

/** The engine's figure for a layout's material: a catalogue entry by id, or the designer's own figures. */
export function materialFigure(m: KitMaterial): MaterialFigure {
  if (m.kind === "catalogue") return materialById(m.id);
  const source = { provenance: ["found" as const], citation: m.source };
  if (m.printed) {
    return {
      kind: "printed",
      id: "custom",
      name: m.name,
      process: "fff",
      acrossLayerStrengthMpa: m.yieldMpa,
      strengthSource: source,
      derateFactor: m.derate,
      derateSource: { provenance: ["common-practice"], citation: "derate factor entered by the designer" },
    };
  }
  // A metal's derate (1 for a certified bar) scales its yield directly.
  return { kind: "metal", id: "custom", name: m.name, yieldStrengthMpa: m.yieldMpa * m.derate, strengthSource: source };
}

/** Per-row grid values, NaN where the tie rod cannot reach (internal only; output uses null). */
interface RowGrid {
  readonly joint: Float64Array;
  readonly road: Float64Array;
  readonly spinZ: Float64Array;
  readonly knuckle: Float64Array;
  readonly shaft: Float64Array;
}

function rowGridBuffers(n: number): RowGrid {
  return { joint: new Float64Array(n), road: new Float64Array(n), spinZ: new Float64Array(n), knuckle: new Float64Array(n), shaft: new Float64Array(n) };
}

/** Fills g (reused from row to row) with the row's values at every rack sample. */
function rowGrid(row: CornerRow, racks: Float64Array, ctx: Context, scratch: PointScratch, g: RowGrid): RowGrid {
  const n = racks.length;
  for (let j = 0; j < n; j++) {
    if (evalPoint(row, racks[j], ctx, scratch)) {
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

interface LockInputs {
  readonly racks: Float64Array;
  readonly leftTurnSign: 1 | -1;
  readonly rackTravelMm: number;
  readonly jointLimitDeg: number;
  readonly jointLimitBy: "neck-contact" | "slot-limit" | "rated-angle";
  readonly ctx: Context;
}

/** The larger joint angle of the two wheels at left-turn rack u (inner at +u, outer mirrored at −u); Infinity where the tie rod cannot reach. */
function lockJointAt(row: CornerRow, sg: number, u: number, ctx: Context, scratch: PointScratch): number {
  if (!evalPoint(row, sg * u, ctx, scratch)) return Infinity;
  const inner = scratch.jointDeg;
  if (!evalPoint(row, -sg * u, ctx, scratch)) return Infinity;
  return inner > scratch.jointDeg ? inner : scratch.jointDeg;
}

/** True when the tie rod reaches at both wheels' rack positions ±u. */
function lockReachesAt(row: CornerRow, sg: number, u: number, ctx: Context, scratch: PointScratch): boolean {
  return evalPoint(row, sg * u, ctx, scratch) && evalPoint(row, -sg * u, ctx, scratch);
}

/**
 * Rack u in [lo, hi] where the joint angle reaches limitDeg: the inside end of an Illinois bracket
 * narrowed to 1e-8 mm of rack (≈ 1e-6° of steer), so the reported lock never passes the limit.
 */
function lockJointRoot(row: CornerRow, li: LockInputs, scratch: PointScratch, lo: number, hi: number): number {
  const sg = li.leftTurnSign;
  const f = (u: number) => {
    const v = lockJointAt(row, sg, u, li.ctx, scratch);
    return v === Infinity ? 1 : v - li.jointLimitDeg;
  };
  const r = rootBracketIllinois(f, lo, hi, 1e-8);
  return r === null ? lo : r.lo;
}

/**
 * Steer lock on one row for a left turn (the right turn mirrors it): rack u from 0 to full travel in the
 * left-turn direction; the left wheel is inner at +u, the right (mirror of the left at −u) is outer.
 * Brackets on the grid samples (symmetric: racks[j] = −racks[n−1−j]), then refines with Brent: the
 * joint limit where the larger joint angle reaches the limit, the linkage limit where the tie rod's
 * reach margin reaches 0; otherwise the end of rack travel.
 */
function steerLockOnRow(row: CornerRow, grid: RowGrid, li: LockInputs, scratch: PointScratch, warnings: string[]): SteerLockResult {
  const { racks, leftTurnSign: sg, jointLimitDeg, ctx } = li;
  const n = racks.length;
  let lockU = li.rackTravelMm;
  let reason: SteerLimitReason = "rack-travel";
  const first = lockJointAt(row, sg, 0, ctx, scratch);
  if (first === Infinity) throw new GeometryError("tie rod", `cannot reach the steering arm with the rack centred at ${describeTravel(row.travelMm)}`);
  if (first >= jointLimitDeg) {
    lockU = 0;
    reason = li.jointLimitBy;
    warnings.push(`drive joint: ${first.toFixed(1)}° already exceeds its ${jointLimitDeg.toFixed(1)}° limit with the wheels straight at ${describeTravel(row.travelMm)}`);
  } else {
    // Walk the samples with u > 0 in increasing u: upward from the centre when the left turn is +rack.
    const half = n >> 1;
    let prevU = 0;
    for (let step = 0; step < n - half; step++) {
      const jIn = sg > 0 ? half + step : n - 1 - half - step;
      const u = sg * racks[jIn];
      if (!(u > 1e-12)) continue;
      const jOut = n - 1 - jIn;
      const a = grid.joint[jIn];
      const b = grid.joint[jOut];
      if (Number.isNaN(a) || Number.isNaN(b)) {
        // The tie rod stops reaching between prevU and u: bisect on the solver's own reach test (so the
        // lock is a point that solves), then check the joint on the way there.
        let lo = prevU;
        let hi = u;
        for (let it = 0; it < 52 && hi - lo > 1e-12; it++) {
          const mid = 0.5 * (lo + hi);
          if (lockReachesAt(row, sg, mid, ctx, scratch)) lo = mid;
          else hi = mid;
        }
        const safeU = lo;
        const jLink = lockJointAt(row, sg, safeU, ctx, scratch);
        if (jLink !== Infinity && jLink >= jointLimitDeg) {
          lockU = lockJointRoot(row, li, scratch, prevU, safeU);
          reason = li.jointLimitBy;
        } else {
          lockU = safeU;
          reason = "linkage";
        }
        break;
      }
      const jv = Number.isNaN(a) || Number.isNaN(b) ? Infinity : a > b ? a : b;
      if (jv >= jointLimitDeg) {
        lockU = lockJointRoot(row, li, scratch, prevU, u);
        reason = li.jointLimitBy;
        break;
      }
      prevU = u;
    }
  }
  if (!lockReachesAt(row, sg, lockU, ctx, scratch)) throw new GeometryError("tie rod", `cannot reach the steering arm at the steer lock at ${describeTravel(row.travelMm)}`);
  evalPoint(row, sg * lockU, ctx, scratch);
  const inner = scratch.roadDeg;
  const innerJoint = scratch.jointDeg;
  evalPoint(row, -sg * lockU, ctx, scratch);
  const outer = -scratch.roadDeg;
  const jointDeg = Math.max(innerJoint, scratch.jointDeg);
  return { travelMm: row.travelMm, rackMm: lockU === 0 ? 0 : sg * lockU, innerDeg: inner, outerDeg: outer, jointAngleDeg: jointDeg, limitedBy: reason };
}

/** Envelope values go out rounded to 1e-4 (degrees) to keep the result compact; null where unsolved. */
function envelopeValue(v: number): number | null {
  return Number.isNaN(v) ? null : Math.round(v * 1e4) / 1e4;
}

/**
 * Analyses a kit layout (left corner; the right mirrors it). `options` sets the grid (bounded, see
 * ANALYZE_LIMITS). Output fields are listed with units and signs in OUTPUT_FIELDS. Throws GeometryError
 * naming the part for impossible geometry: arms that cannot close over the travel range, a tie rod that
 * cannot reach with the rack centred, a neck not smaller than the cup mouth, an unknown material.
 */
export function analyzeLayout(layout: KitLayout, options: AnalyzeOptions = {}): AnalysisResult {
  const nT = checkedSteps(options.travelSteps, "travelSteps");
  const nS = checkedSteps(options.steerSteps, "steerSteps");
  const f = layout.frontView;
  const drive = layout.drive;
  const warnings: string[] = [];

  const fv = frontViewModel(f);
  const travels = travelSteps(f.bumpTravelMm, f.droopTravelMm, nT);
  const poses = frontViewSweep(fv, travels);
  const staticPose = frontViewPoseAtTravel(fv, 0);
  if (Math.abs(staticPose.contactPatch[1]) > 0.5) {
    warnings.push(`tyre: the contact patch sits ${staticPose.contactPatch[1].toFixed(2)} mm from the ground plane z = 0 (wheel centre height vs tyre radius and camber)`);
  }

  const pts = staticPoints(layout);
  const tieRodMm = staticTieRodLengthMm(pts);
  const branch = tieRodBranch(tieRodClosure(armBallCircle(pts.axis, pts.armBall), pts.rackEnd, tieRodMm));
  const ctx: Context = { ix: pts.inboardJoint[0], iy: pts.inboardJoint[1], iz: pts.inboardJoint[2] };
  const shaftStaticMm = Math.hypot(pts.outboardJoint[0] - ctx.ix, pts.outboardJoint[1] - ctx.iy, pts.outboardJoint[2] - ctx.iz);

  const rackTravel = layout.topView.steeringInput.travelMm;
  const racks = new Float64Array(nS);
  for (let j = 0; j < nS; j++) racks[j] = -rackTravel + (2 * rackTravel * j) / (nS - 1);
  const scratch: PointScratch = { knuckleRad: 0, jointDeg: 0, roadDeg: 0, spinZ: 0, shaftMm: 0 };

  // Which rack direction turns left: probe 1 % of the travel at static.
  const staticRow = cornerRow(fv, staticPose, pts, tieRodMm, branch);
  const probe = rackTravel * 0.01;
  if (!evalPoint(staticRow, probe, ctx, scratch)) throw new GeometryError("tie rod", "cannot follow the rack beyond straight ahead (toggle)");
  const leftTurnSign: 1 | -1 = scratch.roadDeg >= 0 ? 1 : -1;

  // Joint limit: the cup (neck contact or slot) against the rated angle.
  const cup: CupMouth = drive.slottedCup
    ? { kind: "slotted", slotAngleDeg: drive.slotLimitDeg ?? NaN }
    : { kind: "plain", mouthDiameterMm: drive.cupMouthDiameterMm, pivotDepthMm: drive.pivotDepthMm };
  const cupLimit = cupArticulationLimit(drive.neckDiameterMm, cup);
  const jointLimitBy = cupLimit.limitDeg < drive.ratedAngleDeg ? (cupLimit.limitedBy === "slot" ? "slot-limit" : "neck-contact") : "rated-angle";
  const jointLimitDeg = Math.min(cupLimit.limitDeg, drive.ratedAngleDeg);
  const lockInputs: LockInputs = { racks, leftTurnSign, rackTravelMm: rackTravel, jointLimitDeg, jointLimitBy, ctx };

  // One travel position's figures, rack centred (also used for the static position itself).
  const travelStepResult = (row: CornerRow, pose: FrontViewPose): TravelStepResult => {
    if (!evalPoint(row, 0, ctx, scratch)) throw new GeometryError("tie rod", `cannot reach the steering arm with the rack centred at ${describeTravel(pose.travelMm)}`);
    const sa = steerAxisFigures(row.axis, [0, pose.wheelCentre[0], pose.wheelCentre[1]], [row.wx, row.wy, row.wz], [0, pose.contactPatch[0], pose.contactPatch[1]]);
    return {
      travelMm: pose.travelMm,
      lowerArmAngleDeg: pose.lowerArmAngleDeg,
      upperArmAngleDeg: pose.upperArmAngleDeg,
      camberDeg: pose.camberDeg,
      camberGainDegPerMm: pose.camberGainDegPerMm,
      trackChangeMm: pose.trackChangeMm,
      contactPatchYMm: pose.contactPatch[0],
      contactPatchZMm: pose.contactPatch[1],
      instantCentreYMm: pose.instantCentre ? pose.instantCentre[0] : null,
      instantCentreZMm: pose.instantCentre ? pose.instantCentre[1] : null,
      rollCentreHeightMm: pose.rollCentreHeightMm,
      kingpinInclinationDeg: sa.kingpinInclinationDeg,
      scrubRadiusMm: sa.scrubRadiusMm,
      bumpSteerDeg: scratch.roadDeg,
      plungeMm: scratch.shaftMm - shaftStaticMm,
      jointAngleDeg: scratch.jointDeg,
    };
  };

  // The envelope: one row per travel step.
  const travelOut: TravelStepResult[] = [];
  const perTravel: SteerLockResult[] = [];
  const envJoint: (number | null)[][] = [];
  const envRoad: (number | null)[][] = [];
  const buffers = rowGridBuffers(nS);
  let maxJoint = -Infinity;
  let maxAtT = 0;
  let maxAtR = 0;
  let maxWithin = -Infinity;
  let plungeMin = Infinity;
  let plungeMax = -Infinity;
  for (let i = 0; i < nT; i++) {
    const pose = poses[i];
    const row = cornerRow(fv, pose, pts, tieRodMm, branch);
    const g = rowGrid(row, racks, ctx, scratch, buffers);
    const lock = steerLockOnRow(row, g, lockInputs, scratch, warnings);
    perTravel.push(lock);
    const jRow: (number | null)[] = new Array(nS);
    const rRow: (number | null)[] = new Array(nS);
    const lockU = Math.abs(lock.rackMm);
    for (let j = 0; j < nS; j++) {
      const jd = g.joint[j];
      jRow[j] = envelopeValue(jd);
      rRow[j] = envelopeValue(g.road[j]);
      if (Number.isNaN(jd)) continue;
      if (!Number.isFinite(jd) || !Number.isFinite(g.road[j])) throw new GeometryError("analysis", `the envelope at ${describeTravel(pose.travelMm)} came out non-finite (please report this layout)`);
      if (jd > maxJoint) {
        maxJoint = jd;
        maxAtT = pose.travelMm;
        maxAtR = racks[j];
      }
      if (Math.abs(racks[j]) <= lockU && jd > maxWithin) maxWithin = jd;
      const pl = g.shaft[j] - shaftStaticMm;
      if (pl < plungeMin) plungeMin = pl;
      if (pl > plungeMax) plungeMax = pl;
    }
    if (lock.jointAngleDeg > maxWithin) maxWithin = lock.jointAngleDeg;
    envJoint.push(jRow);
    envRoad.push(rRow);
    travelOut.push(travelStepResult(row, pose));
  }

  // Steering sweep at static ride height.
  const sg = rowGrid(staticRow, racks, ctx, scratch, buffers);
  const staticLock = steerLockOnRow(staticRow, sg, lockInputs, scratch, warnings);
  const staticFigures = steerAxisFigures(staticRow.axis, pts.wheelCentre, pts.spinAxis, [0, staticPose.contactPatch[0], staticPose.contactPatch[1]]);
  const kingpinTrackMm = 2 * staticFigures.groundPoint[1];
  const wheelbase = layout.topView.wheelbaseMm;
  const steps: SteerStepResult[] = [];
  for (let j = 0; j < nS; j++) {
    const m = nS - 1 - j;
    const left = sg.road[j];
    const right = Number.isNaN(sg.road[m]) ? NaN : -sg.road[m];
    const turn = Math.sign(racks[j]) * leftTurnSign;
    const inner = turn >= 0 ? left : -right;
    const outer = turn >= 0 ? right : -left;
    if (Number.isNaN(left) || Number.isNaN(right)) continue;
    const ackOk = inner >= ACKERMANN_MIN_ANGLE_DEG && outer >= ACKERMANN_MIN_ANGLE_DEG;
    steps.push({
      rackMm: racks[j],
      leftKnuckleRotationDeg: radToDeg(sg.knuckle[j]),
      leftRoadWheelDeg: left,
      rightRoadWheelDeg: right,
      leftCamberDeg: radToDeg(-Math.asin(Math.max(-1, Math.min(1, sg.spinZ[j])))),
      rightCamberDeg: radToDeg(-Math.asin(Math.max(-1, Math.min(1, sg.spinZ[m])))),
      leftJointAngleDeg: sg.joint[j],
      rightJointAngleDeg: sg.joint[m],
      innerDeg: inner,
      outerDeg: outer,
      ackermannTurnCentrePct: ackOk ? ackermannTurnCentrePercent(inner, outer, kingpinTrackMm, wheelbase) : null,
      ackermannInnerRefPct: ackOk ? ackermannInnerReferencePercent(inner, outer, kingpinTrackMm, wheelbase) : null,
      ackermannOuterRefPct: ackOk ? ackermannOuterReferencePercent(inner, outer, kingpinTrackMm, wheelbase) : null,
    });
  }
  const ackAtLock = (fn: typeof ackermannTurnCentrePercent) =>
    staticLock.innerDeg >= ACKERMANN_MIN_ANGLE_DEG && staticLock.outerDeg >= ACKERMANN_MIN_ANGLE_DEG
      ? fn(staticLock.innerDeg, staticLock.outerDeg, kingpinTrackMm, wheelbase)
      : null;

  let worst = perTravel[0];
  for (const l of perTravel) if (l.innerDeg < worst.innerDeg) worst = l;
  for (const l of [staticLock, ...perTravel]) {
    if (l.limitedBy === "linkage") {
      warnings.push(`tie rod cannot reach the steering arm beyond ${l.innerDeg.toFixed(1)}° of steer at ${describeTravel(l.travelMm)}`);
      break;
    }
  }
  if (staticLock.jointAngleDeg > maxWithin) maxWithin = staticLock.jointAngleDeg;

  const fluctuates = DRIVE_JOINT_TYPES[drive.jointType].hasSpeedFluctuation;
  const cardan = fluctuates ? cardanSpeedFluctuation(maxWithin) : null;
  const neckClearance = drive.slottedCup
    ? null
    : (drive.cupMouthDiameterMm / 2) * Math.cos((maxWithin * Math.PI) / 180) - drive.pivotDepthMm * Math.sin((maxWithin * Math.PI) / 180) - drive.neckDiameterMm / 2;

  const st = layout.strength;
  const strength: StrengthResult = analyzeStrength({
    motor: st.motor,
    ratios: st.gearRatios,
    efficiency: st.efficiency,
    shaftsSharing: st.shaftsSharing,
    neck: { diameterMm: drive.neckDiameterMm, boreMm: drive.boreDiameterMm },
    material: materialFigure(st.material),
    criterion: st.material.kind === "custom" ? st.material.shearRule : undefined,
    targetSafetyFactor: st.targetSafetyFactor,
  });

  const result: AnalysisResult = {
    resultSchema: 1,
    grid: { travelSteps: nT, steerSteps: nS },
    travel: travelOut,
    atStatic: travelStepResult(staticRow, staticPose),
    steerAxis: {
      kingpinInclinationDeg: staticFigures.kingpinInclinationDeg,
      casterDeg: staticFigures.casterDeg,
      scrubRadiusMm: staticFigures.scrubRadiusMm,
      casterTrailMm: staticFigures.casterTrailMm,
      hubOffsetMm: staticFigures.hubOffsetMm,
      spindleLengthMm: staticFigures.spindleLengthMm,
      spindleOffsetMm: staticFigures.spindleOffsetMm,
      kingpinTrackMm,
    },
    steering: { leftTurnRackSign: leftTurnSign, tieRodLengthMm: tieRodMm, steps },
    ackermann: {
      convention: "turn-centre (cot δo − cot δi)/(w/L) × 100",
      atLockPct: ackAtLock(ackermannTurnCentrePercent),
      innerRefAtLockPct: ackAtLock(ackermannInnerReferencePercent),
      outerRefAtLockPct: ackAtLock(ackermannOuterReferencePercent),
      kingpinTrackMm,
      wheelbaseMm: wheelbase,
    },
    steerLock: { worst, static: staticLock, perTravel },
    drive: {
      jointType: drive.jointType,
      ratedAngleDeg: drive.ratedAngleDeg,
      neckContactAngleDeg: cupLimit.limitedBy === "mouth-rim" ? cupLimit.limitDeg : null,
      slotLimitDeg: drive.slottedCup ? cupLimit.limitDeg : null,
      jointLimitDeg,
      jointLimitBy,
      shaftLengthStaticMm: shaftStaticMm,
      staticJointAngleDeg: jointOperatingAngleDeg(
        [pts.outboardJoint[0] - ctx.ix, pts.outboardJoint[1] - ctx.iy, pts.outboardJoint[2] - ctx.iz],
        pts.spinAxis,
      ),
      maxJointAngleDeg: maxJoint,
      maxJointAngleAtTravelMm: maxAtT,
      maxJointAngleAtRackMm: maxAtR,
      maxJointAngleWithinLockDeg: maxWithin,
      jointMarginDeg: jointLimitDeg - maxWithin,
      minNeckClearanceMm: neckClearance,
      plungeMinMm: plungeMin,
      plungeMaxMm: plungeMax,
      cardan: cardan
        ? { atJointAngleDeg: maxWithin, maxRatio: cardan.maxRatio, minRatio: cardan.minRatio, fluctuation: cardan.fluctuation, cardanErrorDeg: cardan.cardanErrorDeg }
        : null,
    },
    envelope: { travelMm: travels, rackMm: Array.from(racks), jointAngleDeg: envJoint, leftRoadWheelDeg: envRoad },
    strength,
    warnings,
  };
  assertAllFinite(result);
  return result;
}

/** True when a number anywhere under v (the envelope aside, checked as it is built) is NaN or ±Infinity. */
function hasNonFinite(v: unknown): boolean {
  if (typeof v === "number") return !Number.isFinite(v);
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) if (hasNonFinite(v[i])) return true;
    return false;
  }
  if (v !== null && typeof v === "object") {
    const keys = Object.keys(v);
    for (let i = 0; i < keys.length; i++) if (keys[i] !== "envelope" && hasNonFinite((v as Record<string, unknown>)[keys[i]])) return true;
  }
  return false;
}

/** Dotted path of the first non-finite number under v, for the error message. */
function nonFinitePath(v: unknown, path: string): string | null {
  if (typeof v === "number") return Number.isFinite(v) ? null : path;
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const p = nonFinitePath(v[i], `${path}[${i}]`);
      if (p) return p;
    }
    return null;
  }
  if (v !== null && typeof v === "object") {
    for (const [k, x] of Object.entries(v)) {
      const p = k === "envelope" ? null : nonFinitePath(x, path ? `${path}.${k}` : k);
      if (p) return p;
    }
  }
  return null;
}

/** The last line of defence: a NaN or Infinity anywhere in a result is a bug reported by name, never sent out. */
function assertAllFinite(v: unknown): void {
  if (hasNonFinite(v)) throw new GeometryError("analysis", `${nonFinitePath(v, "") ?? "result"} came out non-finite (please report this layout)`);
}
