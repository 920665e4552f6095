/**
 * One full analysis of a kit layout: front-view sweep over travel, steering at static ride height, the
 * steer × travel envelope of the drive joint with steer lock at every travel, the steering stop the layout
 * needs, steer-axis figures, Ackermann and shaft strength. Pure and synchronous; throws GeometryError for
 * impossible input. The stages live in their own modules (envelope/corner-row.ts solves a point,
 * steering/steer-lock.ts the lock on a row, steering/steering-stop.ts the stop); this file runs them.
 */
import type { AnalysisResult, SteerStepResult, TravelStepResult } from "./analysis-result";
import { staticPoints } from "./corner-points";
import { cardanSpeedFluctuation } from "./drive/cardan";
import { DRIVE_JOINT_TYPES } from "./drive/joint-types";
import { jointOperatingAngleDeg } from "./drive/joint-angle";
import { cupArticulationLimit, type CupMouth } from "./drive/neck-contact";
import { cornerModel, cornerRow, describeTravel, evalPoint, inputGrid, newScratch, rowGrid, rowGridBuffers, type CornerRow } from "./envelope/corner-row";
import { GeometryError } from "./errors";
import type { KitLayout, KitMaterial } from "./kit-layout";
import { radToDeg } from "./math/angle";
import { ackermannInnerReferencePercent, ackermannOuterReferencePercent, ackermannTurnCentrePercent } from "./steering/ackermann";
import { steerLockOnRow, toggleBracketOnRow, type LockInputs } from "./steering/steer-lock";
import { steeringStop } from "./steering/steering-stop";
import { steerAxisFigures } from "./steering/steer-axis";
import { analyzeStrength, materialById, type MaterialFigure, type StrengthResult } from "./strength/index";
import { frontViewModel, frontViewPoseAtTravel, frontViewSweep, travelSteps, type FrontViewPose } from "./suspension/front-view";

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

/** The engine's figure for a layout's material: a catalogue entry by id, or the designer's own figures. */
export function materialFigure(m: KitMaterial): MaterialFigure {
  if (m.kind === "catalogue") return materialById(m.id);
  // The designer's own source, as entered: not a citation of ours.
  const source = { note: `as entered by the designer: ${m.source}`, cites: [] };
  if (m.printed) {
    return {
      kind: "printed",
      id: "custom",
      name: m.name,
      process: "fff",
      acrossLayerStrengthMpa: m.yieldMpa,
      strengthSource: source,
      derateFactor: m.derate,
      derateSource: { note: "derate factor entered by the designer", cites: [] },
    };
  }
  // A metal's derate (1 for a certified bar) scales its yield directly.
  return { kind: "metal", id: "custom", name: m.name, yieldStrengthMpa: m.yieldMpa * m.derate, strengthSource: source };
}

/** Envelope values go out rounded to 1e-4 (degrees) to keep the result compact; null where unsolved. */
function envelopeValue(v: number): number | null {
  return Number.isNaN(v) ? null : Math.round(v * 1e4) / 1e4;
}

/** The proposed stop's set-back when the layout gives none, degrees of inner road-wheel angle (a value of our own). */
export const DEFAULT_STOP_MARGIN_DEG = 1;

/**
 * Analyses a kit layout (left corner; the right mirrors it). `options` sets the grid (bounded, see
 * ANALYZE_LIMITS). Output fields are listed with units and signs in OUTPUT_FIELDS. Throws GeometryError
 * naming the part for impossible geometry: arms that cannot close over the travel range, a tie rod that
 * cannot reach with the steering centred, a neck not smaller than the cup mouth, an unknown material.
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
  const model = cornerModel(fv, pts);
  const ctx = model.ctx;
  const shaftStaticMm = Math.hypot(pts.outboardJoint[0] - ctx.ix, pts.outboardJoint[1] - ctx.iy, pts.outboardJoint[2] - ctx.iz);

  const travel = pts.input.travel;
  const grid = inputGrid(pts.input.kind, travel, nS);
  const inputs = grid.values;
  const scratch = newScratch();

  // Which input direction turns left: probe 1 % of the travel at static.
  const staticRow = cornerRow(model, staticPose);
  if (!evalPoint(staticRow, travel * 0.01, ctx, scratch)) throw new GeometryError("tie rod", "cannot follow the steering input beyond straight ahead (toggle)");
  const leftTurnSign: 1 | -1 = scratch.roadDeg >= 0 ? 1 : -1;

  // Joint limit: the cup (neck contact or slot) against the rated angle.
  const cup: CupMouth = drive.slottedCup
    ? { kind: "slotted", slotAngleDeg: drive.slotLimitDeg ?? NaN }
    : { kind: "plain", mouthDiameterMm: drive.cupMouthDiameterMm, pivotDepthMm: drive.pivotDepthMm };
  const cupLimit = cupArticulationLimit(drive.neckDiameterMm, cup);
  const jointLimitBy = cupLimit.limitDeg < drive.ratedAngleDeg ? (cupLimit.limitedBy === "slot" ? "slot-limit" : "neck-contact") : "rated-angle";
  const jointLimitDeg = Math.min(cupLimit.limitDeg, drive.ratedAngleDeg);
  const lockInputs: LockInputs = { grid, leftTurnSign, travel, jointLimitDeg, jointLimitBy, ctx };

  // One travel position's figures, steering centred (also used for the static position itself).
  const travelStepResult = (row: CornerRow, pose: FrontViewPose): TravelStepResult => {
    if (!evalPoint(row, 0, ctx, scratch)) throw new GeometryError("tie rod", `cannot reach the steering arm with the steering centred at ${describeTravel(pose.travelMm)}`);
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
  const perTravel: AnalysisResult["steerLock"]["perTravel"][number][] = [];
  const rows: CornerRow[] = [];
  const toggles: ReturnType<typeof toggleBracketOnRow>[] = [];
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
    const row = cornerRow(model, pose);
    const g = rowGrid(row, grid, ctx, scratch, buffers);
    const lock = steerLockOnRow(row, g, lockInputs, scratch, warnings);
    rows.push(row);
    perTravel.push(lock);
    toggles.push(toggleBracketOnRow(g, lockInputs));
    const jRow: (number | null)[] = new Array(nS);
    const rRow: (number | null)[] = new Array(nS);
    const lockU = Math.abs(lock.steerInput);
    for (let j = 0; j < nS; j++) {
      const jd = g.joint[j];
      jRow[j] = envelopeValue(jd);
      rRow[j] = envelopeValue(g.road[j]);
      if (Number.isNaN(jd)) continue;
      if (!Number.isFinite(jd) || !Number.isFinite(g.road[j])) throw new GeometryError("analysis", `the envelope at ${describeTravel(pose.travelMm)} came out non-finite (please report this layout)`);
      if (jd > maxJoint) {
        maxJoint = jd;
        maxAtT = pose.travelMm;
        maxAtR = inputs[j];
      }
      if (Math.abs(inputs[j]) <= lockU && jd > maxWithin) maxWithin = jd;
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
  const sg = rowGrid(staticRow, grid, ctx, scratch, buffers);
  const staticLock = steerLockOnRow(staticRow, sg, lockInputs, scratch, warnings);
  const staticFigures = steerAxisFigures(staticRow.axis, pts.wheelCentre, pts.spinAxis, [0, staticPose.contactPatch[0], staticPose.contactPatch[1]]);
  const kingpinTrackMm = 2 * staticFigures.groundPoint[1];
  const wheelbase = layout.topView.wheelbaseMm;
  const steps: SteerStepResult[] = [];
  for (let j = 0; j < nS; j++) {
    const m = nS - 1 - j;
    const left = sg.road[j];
    const right = Number.isNaN(sg.road[m]) ? NaN : -sg.road[m];
    const turn = Math.sign(inputs[j]) * leftTurnSign;
    const inner = turn >= 0 ? left : -right;
    const outer = turn >= 0 ? right : -left;
    if (Number.isNaN(left) || Number.isNaN(right)) continue;
    const ackOk = inner >= ACKERMANN_MIN_ANGLE_DEG && outer >= ACKERMANN_MIN_ANGLE_DEG;
    steps.push({
      steerInput: inputs[j],
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
    if (l.limitedBy === "toggle") {
      warnings.push(`tie rod goes over centre (in line with the steering arm) beyond ${l.innerDeg.toFixed(1)}° of steer at ${describeTravel(l.travelMm)}`);
      break;
    }
  }
  if (staticLock.jointAngleDeg > maxWithin) maxWithin = staticLock.jointAngleDeg;

  const clearanceAtDeg = (deg: number): number | null =>
    drive.slottedCup
      ? null
      : (drive.cupMouthDiameterMm / 2) * Math.cos((deg * Math.PI) / 180) - drive.pivotDepthMm * Math.sin((deg * Math.PI) / 180) - drive.neckDiameterMm / 2;
  const stop = steeringStop({
    model,
    li: lockInputs,
    rows,
    locks: perTravel,
    toggles,
    marginDeg: layout.topView.stopMarginDeg ?? DEFAULT_STOP_MARGIN_DEG,
    clearanceAtDeg,
    scratch,
  });

  const fluctuates = DRIVE_JOINT_TYPES[drive.jointType].hasSpeedFluctuation;
  const cardan = fluctuates ? cardanSpeedFluctuation(maxWithin) : null;

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
    resultSchema: 2,
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
    steering: {
      input: { kind: pts.input.kind, unit: pts.input.kind === "rack" ? "mm" : "deg", travel },
      leftTurnInputSign: leftTurnSign,
      tieRodLengthMm: model.tieRodMm,
      steps,
    },
    ackermann: {
      convention: "turn-centre (cot δo − cot δi)/(w/L) × 100",
      minReportingAngleDeg: ACKERMANN_MIN_ANGLE_DEG,
      atLockPct: ackAtLock(ackermannTurnCentrePercent),
      innerRefAtLockPct: ackAtLock(ackermannInnerReferencePercent),
      outerRefAtLockPct: ackAtLock(ackermannOuterReferencePercent),
      kingpinTrackMm,
      wheelbaseMm: wheelbase,
    },
    steerLock: { worst, static: staticLock, perTravel },
    steeringStop: stop,
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
      maxJointAngleAtSteerInput: maxAtR,
      maxJointAngleWithinLockDeg: maxWithin,
      jointMarginDeg: jointLimitDeg - maxWithin,
      plungeMinMm: plungeMin,
      plungeMaxMm: plungeMax,
      cardan: cardan
        ? { atJointAngleDeg: maxWithin, maxRatio: cardan.maxRatio, minRatio: cardan.minRatio, fluctuation: cardan.fluctuation, cardanErrorDeg: cardan.cardanErrorDeg }
        : null,
    },
    envelope: { travelMm: travels, steerInput: Array.from(inputs), jointAngleDeg: envJoint, leftRoadWheelDeg: envRoad },
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
