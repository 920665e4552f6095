/**
 * Steer lock on one travel row: how far the steering input can move from centre, for a left turn (the
 * right turn mirrors it), before something binds. The lock is one input position for both wheels: the
 * left wheel is inner at +u (in the left-turn direction), the right wheel (the mirror of the left at −u)
 * is outer, and whichever wheel binds first sets it — the outer wheel can. Limits: the drive joint's limit
 * (neck contact, slot, rated angle), the tie rod going over centre (toggle), the end of the input's travel.
 */
import type { SteerLimitReason, SteerLockResult } from "../analysis-result";
import { describeTravel, evalPoint, type Context, type CornerRow, type InputGrid, type PointScratch, type RowGrid } from "../envelope/corner-row";
import { GeometryError } from "../errors";
import { rootBracketIllinois } from "../math/root-find";

export type JointLimitBy = "neck-contact" | "slot-limit" | "rated-angle";

export interface LockInputs {
  readonly grid: InputGrid;
  /** +1 when a + input turns the car left. */
  readonly leftTurnSign: 1 | -1;
  /** Input travel each way (rack mm or bellcrank degrees). */
  readonly travel: number;
  readonly jointLimitDeg: number;
  readonly jointLimitBy: JointLimitBy;
  readonly ctx: Context;
}

/** The larger joint angle of the two wheels at left-turn input u (inner at +u, outer mirrored at −u); Infinity where the tie rod cannot reach. */
export function lockJointAt(row: CornerRow, sg: number, u: number, ctx: Context, scratch: PointScratch): number {
  if (!evalPoint(row, sg * u, ctx, scratch)) return Infinity;
  const inner = scratch.jointDeg;
  if (!evalPoint(row, -sg * u, ctx, scratch)) return Infinity;
  return inner > scratch.jointDeg ? inner : scratch.jointDeg;
}

/** True when the tie rod reaches at both wheels' input positions ±u. */
export function lockReachesAt(row: CornerRow, sg: number, u: number, ctx: Context, scratch: PointScratch): boolean {
  return evalPoint(row, sg * u, ctx, scratch) && evalPoint(row, -sg * u, ctx, scratch);
}

/**
 * Input u in [lo, hi] where the joint angle reaches limitDeg: the inside end of an Illinois bracket
 * narrowed to 1e-8 of the input (≈ 1e-6° of steer), so the reported lock never passes the limit.
 */
export function lockJointRoot(row: CornerRow, li: LockInputs, scratch: PointScratch, lo: number, hi: number): number {
  const sg = li.leftTurnSign;
  const f = (u: number) => {
    const v = lockJointAt(row, sg, u, li.ctx, scratch);
    return v === Infinity ? 1 : v - li.jointLimitDeg;
  };
  const r = rootBracketIllinois(f, lo, hi, 1e-8);
  return r === null ? lo : r.lo;
}

/** The last u in [lo, hi] where the tie rod still reaches at both wheels (bisection on the solver's own reach test, so it solves). */
export function lockToggleBisect(row: CornerRow, sg: number, lo: number, hi: number, ctx: Context, scratch: PointScratch): number {
  for (let it = 0; it < 52 && hi - lo > 1e-12; it++) {
    const mid = 0.5 * (lo + hi);
    if (lockReachesAt(row, sg, mid, ctx, scratch)) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * The walk from centre in the left-turn direction over the grid samples: step k has the inner sample
 * walkInner(li, k) and its mirror n − 1 − that, at u = sg·value > 0 (samples at or behind centre are skipped
 * by the callers' u > 0 test). Plain loops, not a generator: this runs on every travel row.
 */
function walkSteps(li: LockInputs): number {
  const n = li.grid.values.length;
  return n - (n >> 1);
}

function walkInner(li: LockInputs, step: number): number {
  const n = li.grid.values.length;
  const half = n >> 1;
  return li.leftTurnSign > 0 ? half + step : n - 1 - half - step;
}

/**
 * The first grid step of the walk at which the tie rod no longer reaches on this row (either wheel), with
 * the u before it and at it, or null when it reaches all the way. Bisect between them (lockToggleBisect)
 * for the toggle itself; only the rows with the earliest step need it.
 */
export function toggleBracketOnRow(grid: RowGrid, li: LockInputs): { readonly step: number; readonly lo: number; readonly hi: number } | null {
  const n = li.grid.values.length;
  let prevU = 0;
  for (let step = 0, steps = walkSteps(li); step < steps; step++) {
    const jIn = walkInner(li, step);
    const u = li.leftTurnSign * li.grid.values[jIn];
    if (!(u > 1e-12)) continue;
    if (Number.isNaN(grid.joint[jIn]) || Number.isNaN(grid.joint[n - 1 - jIn])) return { step, lo: prevU, hi: u };
    prevU = u;
  }
  return null;
}

/**
 * Steer lock on one row for a left turn (see the module comment). Brackets on the grid samples
 * (symmetric: values[j] = −values[n−1−j]), then refines: the joint limit where the larger joint angle
 * reaches it, the toggle where the tie rod stops reaching; otherwise the end of the input's travel.
 * A joint already past its limit with the input centred gives a lock of 0 and, when `warnings` is given,
 * a sentence saying so.
 */
export function steerLockOnRow(row: CornerRow, grid: RowGrid, li: LockInputs, scratch: PointScratch, warnings: string[] | null): SteerLockResult {
  const { leftTurnSign: sg, jointLimitDeg, ctx } = li;
  let lockU = li.travel;
  let reason: SteerLimitReason = "input-travel";
  const first = lockJointAt(row, sg, 0, ctx, scratch);
  if (first === Infinity) throw new GeometryError("tie rod", `cannot reach the steering arm with the steering centred at ${describeTravel(row.travelMm)}`);
  if (first >= jointLimitDeg) {
    lockU = 0;
    reason = li.jointLimitBy;
    warnings?.push(`drive joint: ${first.toFixed(1)}° already exceeds its ${jointLimitDeg.toFixed(1)}° limit with the wheels straight at ${describeTravel(row.travelMm)}`);
  } else {
    const n = li.grid.values.length;
    let prevU = 0;
    for (let step = 0, steps = walkSteps(li); step < steps; step++) {
      const jIn = walkInner(li, step);
      const u = sg * li.grid.values[jIn];
      if (!(u > 1e-12)) continue;
      const a = grid.joint[jIn];
      const b = grid.joint[n - 1 - jIn];
      if (Number.isNaN(a) || Number.isNaN(b)) {
        // The tie rod stops reaching between prevU and u: find the last point that solves, then check the
        // joint on the way there.
        const safeU = lockToggleBisect(row, sg, prevU, u, ctx, scratch);
        const jLink = lockJointAt(row, sg, safeU, ctx, scratch);
        if (jLink !== Infinity && jLink >= jointLimitDeg) {
          lockU = lockJointRoot(row, li, scratch, prevU, safeU);
          reason = li.jointLimitBy;
        } else {
          lockU = safeU;
          reason = "toggle";
        }
        break;
      }
      if ((a > b ? a : b) >= jointLimitDeg) {
        lockU = lockJointRoot(row, li, scratch, prevU, u);
        reason = li.jointLimitBy;
        break;
      }
      prevU = u;
    }
  }
  return lockResultAt(row, sg, lockU, reason, ctx, scratch);
}

/** The lock figures at left-turn input u on a row. */
export function lockResultAt(row: CornerRow, sg: 1 | -1, u: number, reason: SteerLimitReason, ctx: Context, scratch: PointScratch): SteerLockResult {
  if (!lockReachesAt(row, sg, u, ctx, scratch)) throw new GeometryError("tie rod", `cannot reach the steering arm at the steer lock at ${describeTravel(row.travelMm)}`);
  evalPoint(row, sg * u, ctx, scratch);
  const inner = scratch.roadDeg;
  const innerJoint = scratch.jointDeg;
  evalPoint(row, -sg * u, ctx, scratch);
  const outer = -scratch.roadDeg;
  const jointDeg = Math.max(innerJoint, scratch.jointDeg);
  return { travelMm: row.travelMm, steerInput: u === 0 ? 0 : sg * u, innerDeg: inner, outerDeg: outer, jointAngleDeg: jointDeg, limitedBy: reason };
}

/**
 * Steer lock at a row built for any travel (no grid row at hand), near a lock expected at `hintU` (a
 * neighbouring row's): brackets the first limit by stepping from the hint in quarters of the input grid's
 * spacing, then refines as steerLockOnRow does. Used to find the worst travel between grid rows.
 */
export function steerLockNear(row: CornerRow, li: LockInputs, scratch: PointScratch, hintU: number): SteerLockResult {
  const { leftTurnSign: sg, jointLimitDeg, ctx, travel } = li;
  const first = lockJointAt(row, sg, 0, ctx, scratch);
  if (first === Infinity) throw new GeometryError("tie rod", `cannot reach the steering arm with the steering centred at ${describeTravel(row.travelMm)}`);
  if (first >= jointLimitDeg) return lockResultAt(row, sg, 0, li.jointLimitBy, ctx, scratch);
  const h = (2 * travel) / (li.grid.values.length - 1) / 4;
  const bad = (u: number) => lockJointAt(row, sg, u, ctx, scratch) >= jointLimitDeg; // Infinity (no reach) counts as bad
  let lo = Math.min(Math.max(hintU, 0), travel);
  let hi: number;
  if (bad(lo)) {
    hi = lo;
    do lo = Math.max(0, lo - h);
    while (lo > 0 && bad(lo));
  } else {
    for (hi = lo; hi < travel && !bad(hi); ) {
      lo = hi;
      hi = Math.min(travel, hi + h);
    }
    if (!bad(hi)) return lockResultAt(row, sg, travel, "input-travel", ctx, scratch);
  }
  if (lockJointAt(row, sg, hi, ctx, scratch) === Infinity) {
    const safeU = lockToggleBisect(row, sg, lo, hi, ctx, scratch);
    const jLink = lockJointAt(row, sg, safeU, ctx, scratch);
    if (!(jLink >= jointLimitDeg)) return lockResultAt(row, sg, safeU, "toggle", ctx, scratch);
    hi = safeU;
  }
  return lockResultAt(row, sg, lockJointRoot(row, li, scratch, lo, hi), li.jointLimitBy, ctx, scratch);
}
