/**
 * The steering stop a layout needs. Where the drive joint's limit (neck contact, slot, rated angle) or the
 * tie rod's toggle binds before the end of the steering input's travel, the linkage would still drive the
 * wheel further if the input could go further, and the part breaks: a stop must keep the input short of
 * the limit at every suspension travel. The limit comes earliest along the input at one travel (the worst
 * travel): found on the analysis's travel rows, then refined between them by golden-section search (at an
 * end row only where a parabola through the last three rows says the extreme lies inside). The
 * stop is proposed a margin short of it (degrees of the inner road wheel at the worst travel), and the
 * margins it leaves are checked over the whole travel range: the joint angle still free before the limit
 * and, for a plain cup, the neck's gap to the mouth rim.
 */
import type { SteerLockResult, SteeringStopResult } from "../analysis-result";
import { cornerRowAtTravel, evalPoint, type CornerModel, type CornerRow, type PointScratch } from "../envelope/corner-row";
import { minimizeGolden } from "../math/minimize";
import { rootBracketIllinois } from "../math/root-find";
import { lockJointAt, lockResultAt, lockToggleBisect, steerLockNear, type LockInputs } from "./steer-lock";

export interface StopInputs {
  readonly model: CornerModel;
  readonly li: LockInputs;
  /** The analysis's travel rows and the lock found on each. */
  readonly rows: readonly CornerRow[];
  readonly locks: readonly SteerLockResult[];
  /** Where the tie rod stops reaching on each row, as a grid bracket (steer-lock.ts toggleBracketOnRow), null where it reaches all the way. */
  readonly toggles: readonly ({ readonly step: number; readonly lo: number; readonly hi: number } | null)[];
  /** Set-back of the proposed stop, degrees of inner road-wheel angle. */
  readonly marginDeg: number;
  /** Neck-to-mouth gap at a joint angle (degrees), mm; null for a slotted cup. */
  readonly clearanceAtDeg: (jointDeg: number) => number | null;
  readonly scratch: PointScratch;
}

/** Travel precision of the refinement between rows, mm. */
const TRAVEL_TOL_MM = 1e-4;

/**
 * The smallest of g over the travel range, given its values on the rows (smallest at row i): refined by
 * golden-section search between row i's neighbours. At an end row the search runs only when the parabola
 * through the three end rows has its minimum inside the end interval: a g still falling towards the end of
 * travel has its minimum there, and the rows already hold it (each refinement costs a travel solve per step).
 */
function refineMin(rows: readonly CornerRow[], values: readonly number[], i: number, g: (t: number) => number): { x: number; fx: number } {
  const n = rows.length;
  const t = (k: number) => rows[k]!.travelMm;
  const atRow = { x: t(i), fx: values[i]! };
  if (n < 2 || !Number.isFinite(atRow.fx)) return atRow;
  let lo: number;
  let hi: number;
  if (i > 0 && i < n - 1) {
    lo = t(i - 1);
    hi = t(i + 1);
  } else {
    const k1 = i === 0 ? 1 : n - 2;
    if (n >= 3) {
      const k2 = i === 0 ? 2 : n - 3;
      const [x0, x1, x2] = [t(i), t(k1), t(k2)];
      const [y0, y1, y2] = [values[i]!, values[k1]!, values[k2]!];
      // Vertex of the parabola through the three points; its curvature sign says minimum or maximum.
      const d = (x0 - x1) * (x0 - x2) * (x1 - x2);
      const a = (x2 * (y1 - y0) + x1 * (y0 - y2) + x0 * (y2 - y1)) / d;
      const b = (x2 * x2 * (y0 - y1) + x1 * x1 * (y2 - y0) + x0 * x0 * (y1 - y2)) / d;
      const vertex = -b / (2 * a);
      if (!(a > 0 && (vertex - x0) * (vertex - x1) < 0)) return atRow;
    }
    lo = Math.min(t(i), t(k1));
    hi = Math.max(t(i), t(k1));
  }
  const r = minimizeGolden(g, lo, hi, TRAVEL_TOL_MM);
  return r.fx < atRow.fx ? r : atRow;
}

/** The inner road-wheel angle at left-turn input u on a row, degrees. */
function innerAt(row: CornerRow, sg: number, u: number, s: StopInputs): number {
  return evalPoint(row, sg * u, s.li.ctx, s.scratch) ? s.scratch.roadDeg : NaN;
}

/** The largest joint angle of either wheel at left-turn input u over the whole travel range: rows, then refined near the largest. */
function worstJointAt(u: number, s: StopInputs): { jointDeg: number; travelMm: number } {
  const { li, rows, model, scratch } = s;
  const sg = li.leftTurnSign;
  const neg = rows.map((row) => -lockJointAt(row, sg, u, li.ctx, scratch));
  let best = 0;
  neg.forEach((v, i) => {
    if (v < neg[best]!) best = i;
  });
  const r = refineMin(rows, neg, best, (t) => -lockJointAt(cornerRowAtTravel(model, t), sg, u, li.ctx, scratch));
  return { jointDeg: -r.fx, travelMm: r.x };
}

/** The steering stop (see the module comment). */
export function steeringStop(s: StopInputs): SteeringStopResult {
  const { li, rows, locks, model, scratch } = s;
  const sg = li.leftTurnSign;
  const lim = li.jointLimitDeg;

  // The worst travel: the smallest lock along the input, on the rows then between them.
  let wi = 0;
  locks.forEach((l, i) => {
    if (Math.abs(l.steerInput) < Math.abs(locks[wi]!.steerInput)) wi = i;
  });
  let worst: SteerLockResult = locks[wi]!;
  let worstRow: CornerRow = rows[wi]!;
  if (Math.abs(worst.steerInput) > 0 && rows.length > 1) {
    const hint = Math.abs(worst.steerInput);
    const lockU = locks.map((l) => Math.abs(l.steerInput));
    const r = refineMin(rows, lockU, wi, (t) => Math.abs(steerLockNear(cornerRowAtTravel(model, t), li, scratch, hint).steerInput));
    if (r.fx < hint) {
      worstRow = cornerRowAtTravel(model, r.x);
      worst = steerLockNear(worstRow, li, scratch, hint);
    }
  }

  // Whether the joint passes its limit at the end of travel somewhere between the rows, unseen by them.
  if (worst.limitedBy === "input-travel") {
    const end = worstJointAt(li.travel, s);
    if (end.jointDeg >= lim) {
      worstRow = cornerRowAtTravel(model, end.travelMm);
      worst = steerLockNear(worstRow, li, scratch, li.travel);
    }
  }

  // The toggle: bisected only on the rows where the tie rod stops reaching at the earliest grid step.
  let firstStep = Infinity;
  for (const b of s.toggles) if (b && b.step < firstStep) firstStep = b.step;
  let firstToggle: { u: number; travelMm: number } | null = null;
  s.toggles.forEach((b, i) => {
    if (!b || b.step !== firstStep) return;
    const u = lockToggleBisect(rows[i]!, sg, b.lo, b.hi, li.ctx, scratch);
    if (!firstToggle || u < firstToggle.u) firstToggle = { u, travelMm: rows[i]!.travelMm };
  });
  const found = firstToggle as { u: number; travelMm: number } | null;
  const toggle = found ? { steerInput: sg * found.u, travelMm: found.travelMm } : null;

  const limitU = Math.abs(worst.steerInput);
  const needed = worst.limitedBy !== "input-travel";
  const status: SteeringStopResult["status"] = !needed ? "not-needed" : limitU === 0 ? "no-position" : "needed";

  // The proposed stop: the inner wheel at the worst travel marginDeg short of its angle at the limit.
  let stopU = limitU;
  if (status === "needed" && s.marginDeg > 0) {
    const target = worst.innerDeg - s.marginDeg;
    const inner0 = innerAt(worstRow, sg, 0, s);
    if (!(target > inner0)) stopU = 0;
    else {
      const root = rootBracketIllinois((u) => innerAt(worstRow, sg, u, s) - target, 0, limitU, 1e-9);
      stopU = root === null ? limitU : root.lo;
    }
  }
  const atStop = stopU === limitU ? worst : lockResultAt(worstRow, sg, stopU, worst.limitedBy, li.ctx, scratch);
  const jointAtStop = worstJointAt(stopU, s).jointDeg;
  return {
    status,
    limitedBy: worst.limitedBy,
    worstTravelMm: worst.travelMm,
    limitInput: worst.steerInput,
    limitInnerDeg: worst.innerDeg,
    limitOuterDeg: worst.outerDeg,
    leftTurnStopInput: stopU === 0 ? 0 : sg * stopU,
    rightTurnStopInput: stopU === 0 ? 0 : -sg * stopU,
    marginDeg: s.marginDeg,
    stopInnerDeg: atStop.innerDeg,
    stopOuterDeg: atStop.outerDeg,
    jointAngleAtStopDeg: jointAtStop,
    angleMarginDeg: lim - jointAtStop,
    clearanceAtStopMm: s.clearanceAtDeg(jointAtStop),
    overrun: needed ? li.travel - limitU : 0,
    toggle,
  };
}
