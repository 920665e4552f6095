import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS, TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { analyzeLayout, cornerPoseAt, cornerPoser, GeometryError, type AnalysisResult, type CornerPoser } from "@/engine/index";
import { layoutNearDemo } from "../arbitrary-layout";
import { expectNear } from "../near";

// The steering stop is checked here against the pose solver the editor draws with (cornerPoseAt), over a
// travel grid four to ten times finer than the analysis's own, so a stop placed only by the analysis's rows
// would be caught where the limit falls between them. Joint limits: the neck-in-cup formula and the rated
// angle, whose own checks are in drive/neck-contact.test.ts.
const GRID = { travelSteps: 13, steerSteps: 31 };
const FINE_TRAVEL_STEP_MM = 0.05;

function travels(layout: Layout): number[] {
  const f = layout.frontView;
  const out: number[] = [];
  for (let t = -f.droopTravelMm; t <= f.bumpTravelMm + 1e-9; t += FINE_TRAVEL_STEP_MM) out.push(t);
  out.push(f.bumpTravelMm);
  return out;
}

/** The larger joint angle of the two wheels at input q (left at q, right mirrored at −q); Infinity where either cannot be assembled. */
function jointAt(poser: CornerPoser, travelMm: number, q: number): number {
  const p = cornerPoseAt(poser, travelMm, q);
  return p.left.steerSolved && p.right.steerSolved ? Math.max(p.left.jointAngleDeg, p.right.jointAngleDeg) : Infinity;
}

/** The first left-turn input u (> 0 along the turn) at this travel where the joint passes `limit` or the tie rod stops reaching, by bisection on the pose solver; the travel end when neither happens. */
function lockByPoses(poser: CornerPoser, a: AnalysisResult, travelMm: number): number {
  const sg = a.steering.leftTurnInputSign;
  const end = a.steering.input.travel;
  const bad = (u: number) => jointAt(poser, travelMm, sg * u) >= a.drive.jointLimitDeg;
  const n = 400;
  let prev = 0;
  for (let k = 1; k <= n; k++) {
    const u = (end * k) / n;
    if (bad(u)) {
      let lo = prev;
      let hi = u;
      for (let i = 0; i < 60; i++) {
        const mid = (lo + hi) / 2;
        if (bad(mid)) hi = mid;
        else lo = mid;
      }
      return lo;
    }
    prev = u;
  }
  return end;
}

// A fine grid of poses per kit: seconds on a loaded machine, so room to finish (not a speed check).
describe("the steering stop of each demo kit", { timeout: 60_000 }, () => {
  it.each(DEMO_LAYOUTS.map((d) => [d.key, d.layout] as const))("%s: needs a stop, at the limit of the worst travel; no travel passes the limit at the stop (fine grid)", (_, layout) => {
    const a = analyzeLayout(layout, GRID);
    const s = a.steeringStop;
    const poser = cornerPoser(layout);
    const sg = a.steering.leftTurnInputSign;
    const lim = a.drive.jointLimitDeg;
    expect(s.status).toBe("needed");
    expect(s.limitedBy).toBe(a.drive.jointLimitBy);
    expect(Math.sign(s.limitInput)).toBe(sg);
    expectNear(s.rightTurnStopInput, -s.leftTurnStopInput, 0, "the right-turn stop mirrors the left");

    // At the worst travel the binding limit is reached exactly at limitInput (the joint at its limit) ...
    expectNear(jointAt(poser, s.worstTravelMm, s.limitInput), lim, 1e-6, "joint angle at the limit position");
    // ... and limitInput is the smallest lock over a fine travel grid: it is the worst travel.
    let smallest = Infinity;
    for (const t of travels(layout)) smallest = Math.min(smallest, lockByPoses(poser, a, t));
    expect(Math.abs(s.limitInput)).toBeLessThanOrEqual(smallest + 1e-7);
    expect(Math.abs(s.limitInput)).toBeGreaterThan(smallest - 1e-3 * a.steering.input.travel);

    // At the limit position and at the proposed stop, no travel position and no input short of it passes the limit.
    for (const stop of [Math.abs(s.limitInput), Math.abs(s.leftTurnStopInput)]) {
      let worst = 0;
      for (const t of travels(layout)) for (let k = 0; k <= 20; k++) worst = Math.max(worst, jointAt(poser, t, (sg * stop * k) / 20));
      expect(worst, `largest joint angle up to the stop ${stop}`).toBeLessThanOrEqual(lim + 1e-6);
    }

    // The proposed stop is 1° of inner-wheel steer short of the limit at the worst travel, and its margins are real.
    expectNear(s.limitInnerDeg - s.stopInnerDeg, 1, 1e-6, "set-back in inner-wheel angle");
    expectNear(cornerPoseAt(poser, s.worstTravelMm, s.leftTurnStopInput).left.roadWheelDeg * sg * Math.sign(s.leftTurnStopInput), s.stopInnerDeg, 1e-6, "inner wheel at the stop");
    expect(s.angleMarginDeg).toBeGreaterThan(0.5);
    let atStop = 0;
    for (const t of travels(layout)) atStop = Math.max(atStop, jointAt(poser, t, s.leftTurnStopInput));
    expectNear(s.jointAngleAtStopDeg, atStop, 1e-4, "largest joint angle at the stop over the fine grid");
    if (!layout.drive.slottedCup) expect(s.clearanceAtStopMm!).toBeGreaterThan(0);
    expectNear(s.overrun, a.steering.input.travel - Math.abs(s.limitInput), 1e-12, "overrun");
  });
});

describe("a layout whose input cannot reach the limit needs no stop", () => {
  const short: Layout = { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, steeringInput: { kind: "rack", travelMm: 3 } } };

  it("says so: status not-needed, the end of travel as the stop, margins at the end of travel", () => {
    const a = analyzeLayout(short, GRID);
    const s = a.steeringStop;
    expect(s.status).toBe("not-needed");
    expect(s.limitedBy).toBe("input-travel");
    expect(s.overrun).toBe(0);
    expect(Math.abs(s.leftTurnStopInput)).toBe(3);
    expect(s.toggle).toBeNull();
    const poser = cornerPoser(short);
    let worst = 0;
    for (const t of travels(short)) worst = Math.max(worst, jointAt(poser, t, 3), jointAt(poser, t, -3));
    expect(worst).toBeLessThan(a.drive.jointLimitDeg);
    expectNear(s.jointAngleAtStopDeg, worst, 1e-4, "joint at the end of travel, worst travel");
    expectNear(s.angleMarginDeg, a.drive.jointLimitDeg - worst, 1e-4, "angle margin");
  });
});

describe("the tie-rod toggle is a limit too", () => {
  // The first demo baseline threw its rack ±10 mm, past its own tie-rod toggle (about ±7.35 mm at ride height):
  // the neck binds first, so the lock was right, but the stop readout must catch the toggle.
  const overThrown: Layout = { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, steeringInput: { kind: "rack", travelMm: 10 } } };

  it("the ±10 mm rack is caught: stop needed for the neck, the toggle reported where the tie rod goes over centre", () => {
    const a = analyzeLayout(overThrown, GRID);
    const s = a.steeringStop;
    expect(s.status).toBe("needed");
    expect(s.limitedBy).toBe("neck-contact");
    expect(s.toggle).not.toBeNull();
    const poser = cornerPoser(overThrown);
    const sg = a.steering.leftTurnInputSign;
    // At the travel the toggle is reported for, the pose solver assembles just short of it and not just past it.
    const u = Math.abs(s.toggle!.steerInput);
    expect(jointAt(poser, s.toggle!.travelMm, sg * (u - 1e-6))).toBeLessThan(Infinity);
    expect(jointAt(poser, s.toggle!.travelMm, sg * (u + 1e-4))).toBe(Infinity);
    // Independently, at ride height the toggle is near ±7.35 mm (the figure of the independent check).
    let lo = 0;
    let hi = 10;
    for (let i = 0; i < 60; i++) {
      const mid = (lo + hi) / 2;
      if (jointAt(poser, 0, sg * mid) < Infinity) lo = mid;
      else hi = mid;
    }
    expectNear(lo, 7.35, 0.01, "toggle at ride height");
    expect(u).toBeLessThanOrEqual(lo + 1e-9);
  });

  it("a linkage that goes over centre before the joint binds is stopped short of the toggle", () => {
    const layout: Layout = {
      ...TARNWICK_10_BASE,
      topView: { ...TARNWICK_10_BASE.topView, steeringArmBall: { x: -9, y: 104, z: 36 }, steeringInput: { kind: "rack", travelMm: 20 } },
      drive: { ...TARNWICK_10_BASE.drive, jointType: "cv-ball", ratedAngleDeg: 89, cupMouthDiameterMm: 30, pivotDepthMm: 0, neckDiameterMm: 1 },
    };
    const a = analyzeLayout(layout, GRID);
    const s = a.steeringStop;
    expect(s.limitedBy).toBe("toggle");
    const poser = cornerPoser(layout);
    for (const t of travels(layout)) expect(jointAt(poser, t, s.leftTurnStopInput)).toBeLessThan(Infinity);
    expect(Math.abs(s.leftTurnStopInput)).toBeLessThan(Math.abs(s.limitInput));
  });
});

describe("no stop can help a joint past its limit with the wheels straight", () => {
  it("status no-position, with the warning sentence", () => {
    // A joint rated only 8° (in a wide cup): the shaft already bends further than that at full bump, wheels straight.
    const layout: Layout = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, jointType: "cvd", ratedAngleDeg: 8, cupMouthDiameterMm: 20 } };
    const a = analyzeLayout(layout, GRID);
    expect(a.steerLock.worst.steerInput).toBe(0);
    expect(a.steeringStop.status).toBe("no-position");
    expect(a.warnings.some((w) => w.includes("already exceeds"))).toBe(true);
  });
});

describe("over random layouts near the demo (fast-check)", { timeout: 60_000 }, () => {
  it("no travel row passes the joint limit or the toggle at the proposed stop", () => {
    fc.assert(
      fc.property(layoutNearDemo, (layout) => {
        let a: AnalysisResult;
        try {
          a = analyzeLayout(layout, GRID);
        } catch (e) {
          expect(e).toBeInstanceOf(GeometryError);
          return;
        }
        const s = a.steeringStop;
        if (s.status === "no-position") return;
        const poser = cornerPoser(layout);
        const f = layout.frontView;
        for (let k = 0; k <= 48; k++) {
          const t = -f.droopTravelMm + ((f.bumpTravelMm + f.droopTravelMm) * k) / 48;
          expect(jointAt(poser, t, s.leftTurnStopInput)).toBeLessThanOrEqual(a.drive.jointLimitDeg + 1e-6);
        }
      }),
      { numRuns: 40 },
    );
  });
});
