/**
 * The steering stop a layout needs. Where the drive joint's limit (neck contact, slot, rated angle) or the
 * tie rod's toggle binds before the end of the steering input's travel, the linkage would still drive the
 * wheel further if the input could go further, and the part breaks: a stop must keep the input short of
 * the limit at every suspension travel. The limit comes earliest along the input at one travel (the worst
 * travel): found on the analysis's travel rows, then refined between them by golden-section search. The
 * stop is proposed a margin short of it (degrees of the inner road wheel at the worst travel), and the
 * margins it leaves are checked over the whole travel range: the joint angle still free before the limit
 * and, for a plain cup, the neck's gap to the mouth rim.
 */
import type { SteerLockResult, SteeringStopResult } from "../analysis-result";
import { cornerRowAtTravel, evalPoint, type CornerModel, type CornerRow, type PointScratch } from "../envelope/corner-row";
import { minimizeGolden } from "../math/minimize";
import { rootBracketIllinois } from "../math/root-find";
import { lockJointAt, lockResultAt, steerLockNear, type LockInputs } from "./steer-lock";

export interface StopInputs {
  readonly model: CornerModel;
  readonly li: LockInputs;
  /** The analysis's travel rows and the lock found on each. */
  readonly rows: readonly CornerRow[];
  readonly locks: readonly SteerLockResult[];
  /** Where the tie rod toggles on each row within the travel (left-turn input), null where it does not. */
  readonly toggles: readonly (number | null)[];
  /** Set-back of the proposed stop, degrees of inner road-wheel angle. */
  readonly marginDeg: number;
  /** Neck-to-mouth gap at a joint angle (degrees), mm; null for a slotted cup. */
  readonly clearanceAtDeg: (jointDeg: number) => number | null;
  readonly scratch: PointScratch;
}

/** Travel precision of the refinement between rows, mm. */
const TRAVEL_TOL_MM = 1e-4;

function neighbours(rows: readonly CornerRow[], i: number): [number, number] {
  return [rows[Math.max(0, i - 1)]!.travelMm, rows[Math.min(rows.length - 1, i + 1)]!.travelMm];
}

/** The inner road-wheel angle at left-turn input u on a row, degrees. */
function innerAt(row: CornerRow, sg: number, u: number, s: StopInputs): number {
  return evalPoint(row, sg * u, s.li.ctx, s.scratch) ? s.scratch.roadDeg : NaN;
}

/** The largest joint angle of either wheel at left-turn input u over the whole travel range: rows, then refined near the largest. */
function worstJointAt(u: number, s: StopInputs): { jointDeg: number; travelMm: number } {
  const { li, rows, model, scratch } = s;
  const sg = li.leftTurnSign;
  let best = 0;
  let jMax = -Infinity;
  rows.forEach((row, i) => {
    const j = lockJointAt(row, sg, u, li.ctx, scratch);
    if (j > jMax) {
      jMax = j;
      best = i;
    }
  });
  if (rows.length < 2 || jMax === Infinity) return { jointDeg: jMax, travelMm: rows[best]!.travelMm };
  const [a, b] = neighbours(rows, best);
  const r = minimizeGolden((t) => -lockJointAt(cornerRowAtTravel(model, t), sg, u, li.ctx, scratch), a, b, TRAVEL_TOL_MM);
  return -r.fx > jMax ? { jointDeg: -r.fx, travelMm: r.x } : { jointDeg: jMax, travelMm: rows[best]!.travelMm };
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
    const [a, b] = neighbours(rows, wi);
    const hint = Math.abs(worst.steerInput);
    const r = minimizeGolden((t) => Math.abs(steerLockNear(cornerRowAtTravel(model, t), li, scratch, hint).steerInput), a, b, TRAVEL_TOL_MM);
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

  const toggleRows = s.toggles.map((u, i) => (u === null ? null : { u, travelMm: rows[i]!.travelMm })).filter((x) => x !== null);
  const firstToggle = toggleRows.reduce<{ u: number; travelMm: number } | null>((m, x) => (m === null || x.u < m.u ? x : m), null);
  const toggle = firstToggle ? { steerInput: sg * firstToggle.u, travelMm: firstToggle.travelMm } : null;

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
