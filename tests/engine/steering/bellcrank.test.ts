import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE, TARNWICK_10_BELLCRANK } from "@/contracts/demo-layouts";
import { parseLayout, type Layout } from "@/contracts/layout";
import { analyzeLayout, cornerPoseAt, cornerPoser } from "@/engine/index";
import { degToRad, radToDeg } from "@/engine/math/angle";
import type { Vec3 } from "@/engine/math/vec3";
import { armBallCircle, bellcrankLinkage, innerBallAt, inputReachMargin, knuckleRotationForInputRads, tieRodBranch, tieRodClosure } from "@/engine/steering/linkage";
import { DEG_TOL, expectNear } from "../near";

/**
 * The reference: the four-bar's output angle in closed form, Norton's algebraic solution of Freudenstein's
 * equation (R. L. Norton, Design of Machinery 5th ed., ch. 4, from memory; A. Ghosal, "The Freudenstein
 * Equation", Resonance 2010): K1 = d/a, K2 = d/c, K3 = (a² − b² + c² + d²)/(2ac),
 * A = cos θ2 − K1 − K2 cos θ2 + K3, B = −2 sin θ2, C = K1 − (K2 + 1) cos θ2 + K3,
 * θ4 = 2 atan2(−B − √(B² − 4AC), 2A) (open). Written here independently of the engine's tie-rod closure.
 */
function nortonOutputDeg(a: number, b: number, c: number, d: number, theta2Deg: number): number | null {
  const t = degToRad(theta2Deg);
  const k1 = d / a;
  const k2 = d / c;
  const k3 = (a * a - b * b + c * c + d * d) / (2 * a * c);
  const A = Math.cos(t) - k1 - k2 * Math.cos(t) + k3;
  const B = -2 * Math.sin(t);
  const C = k1 - (k2 + 1) * Math.cos(t) + k3;
  const disc = B * B - 4 * A * C;
  if (disc < 0) return null;
  const deg = radToDeg(2 * Math.atan2(-B - Math.sqrt(disc), 2 * A));
  return ((deg % 360) + 540) % 360 - 180;
}

/**
 * A bellcrank four-bar laid flat in the ground plane: bellcrank pivot O2 at the origin (input link a),
 * tie rod b, steering arm c about a vertical kingpin at O4 = (d, 0), in the engine's own parts.
 */
function planarBellcrank(a: number, b: number, c: number, d: number, theta2Deg: number) {
  const t4 = nortonOutputDeg(a, b, c, d, theta2Deg)!;
  const circle = armBallCircle({ point: [d, 0, 0], direction: [0, 0, 1] }, [d + c * Math.cos(degToRad(t4)), c * Math.sin(degToRad(t4)), 0]);
  const inner: Vec3 = [a * Math.cos(degToRad(theta2Deg)), a * Math.sin(degToRad(theta2Deg)), 0];
  const branch = tieRodBranch(tieRodClosure(circle, inner, b));
  return { t4, lk: bellcrankLinkage(circle, inner, [0, 0, 0], b, branch), circle };
}

describe("bellcrank steering against a closed-form four-bar (Norton's Freudenstein solution)", () => {
  // Link sets of the four-bar check cases (the first is, from memory, Norton's example 4-1: 40/120/80/100).
  it.each([
    [40, 120, 80, 100],
    [30, 70, 60, 80],
    [25, 60, 45, 70],
  ])("a, b, c, d = %d, %d, %d, %d: the knuckle follows θ4(θ2) over a whole turn of the crank", (a, b, c, d) => {
    const { t4, lk } = planarBellcrank(a, b, c, d, 0);
    for (let q = -180; q <= 180; q += 7.5) {
      const ref = nortonOutputDeg(a, b, c, d, q);
      const phi = knuckleRotationForInputRads(lk, q);
      if (ref === null) {
        expect(phi, `no assembly at θ2 = ${q}°`).toBeNull();
        continue;
      }
      expect(phi, `assembles at θ2 = ${q}°`).not.toBeNull();
      const got = (((t4 + radToDeg(phi!)) % 360) + 540) % 360 - 180;
      expectNear(got, ref, 1e-9, `θ4 at θ2 = ${q}°`);
    }
  });

  it("reproduces the published check values: 40/120/80/100 θ4 open 62.7204° at 0°, 57.3249° at 40°, 121.1886° at 180°", () => {
    const { t4, lk } = planarBellcrank(40, 120, 80, 100, 0);
    expectNear(t4, 62.7204, DEG_TOL, "θ4 at 0°");
    expectNear(t4 + radToDeg(knuckleRotationForInputRads(lk, 40)!), 57.3249, DEG_TOL, "θ4 at 40°");
    expectNear(t4 + radToDeg(knuckleRotationForInputRads(lk, 180)!), 121.1886, DEG_TOL, "θ4 at 180°");
  });

  it("a non-Grashof set (40/50/30/100) stops assembling at θ2 = 49.4584°: the closure's toggle, B² − 4AC = 0", () => {
    // Check case: assembles only for |θ2| ≤ 49.4584°, where the crank pin's distance to O4 reaches b + c.
    const { lk } = planarBellcrank(40, 50, 30, 100, 0);
    expect(knuckleRotationForInputRads(lk, 49.45)).not.toBeNull();
    expect(knuckleRotationForInputRads(lk, 49.47)).toBeNull();
    expect(inputReachMargin(lk, 49.45)).toBeGreaterThan(0);
    expect(inputReachMargin(lk, 49.47)).toBeLessThan(0);
  });

  it("keeps the tie rod at its length with the inner ball on its arc (innerBallAt)", () => {
    const { lk, circle } = planarBellcrank(40, 120, 80, 100, 0);
    for (const q of [-60, -20, 15, 75, 130]) {
      const phi = knuckleRotationForInputRads(lk, q)!;
      const ball = [circle.centre[0] + circle.radial[0] * Math.cos(phi) + circle.tangent[0] * Math.sin(phi), circle.centre[1] + circle.radial[1] * Math.cos(phi) + circle.tangent[1] * Math.sin(phi)];
      const inner = innerBallAt("bellcrank", [40, 0, 0], [0, 0, 0], q);
      expectNear(Math.hypot(inner[0], inner[1]), 40, 1e-12, "arm length");
      expectNear(Math.hypot(ball[0]! - inner[0], ball[1]! - inner[1]), 120, 1e-9, `tie rod at ${q}°`);
    }
  });
});

describe("rack and bellcrank agree when the bellcrank's arc is nearly straight", () => {
  const b = TARNWICK_10_BASE;
  const t = b.topView;
  const rackTravel = (b.topView.steeringInput as { travelMm: number }).travelMm;
  /** The baseline with the rack replaced by a bellcrank arm of radius R pointing rearward from a pivot R ahead of the inner ball. */
  const bellcrankOf = (R: number): Layout => ({
    ...b,
    topView: { ...t, steeringInput: { kind: "bellcrank", pivot: { x: t.tieRodInner.x + R, y: t.tieRodInner.y }, travelDeg: radToDeg(Math.asin(rackTravel / R)) } },
  });
  const grid = { travelSteps: 9, steerSteps: 21 };
  const rack = analyzeLayout(b, grid);

  it("a 700 mm arm (a valid layout): the same lock, the outer wheel within 0.01°, the stop within 0.002 mm, every pose within 0.05°", () => {
    const layout = bellcrankOf(700);
    expect(parseLayout(layout).ok).toBe(true);
    const bc = analyzeLayout(layout, grid);
    // The arm points rearward, so a + (counter-clockwise) turn moves the inner ball to −y: the rack's left turn.
    expect(bc.steering.leftTurnInputSign).toBe(-rack.steering.leftTurnInputSign);
    expectNear(bc.steerLock.worst.innerDeg, rack.steerLock.worst.innerDeg, 1e-6, "inner wheel at lock (the neck binds at the same angle)");
    expectNear(bc.steerLock.static.outerDeg, rack.steerLock.static.outerDeg, 0.01, "outer wheel at lock");
    // The arc's sagitta s²/(2R) = 0.03 mm at 6.5 mm is all that separates them.
    expectNear(-700 * Math.sin(degToRad(bc.steeringStop.leftTurnStopInput)), rack.steeringStop.leftTurnStopInput, 0.002, "stop as inner-ball travel");
    // Matched positions: bellcrank +θ moves the inner ball across by −R sin θ, a rack at s by +s. The arc also
    // moves it 0.03 mm rearward at 6.5 mm (the sagitta), worth a few hundredths of a degree near lock: 0.05°.
    const rp = cornerPoser(b);
    const bp = cornerPoser(layout);
    for (const travel of [-10, 0, 14]) {
      for (const s of [-6.5, -3, 0, 2, 6.5]) {
        const r = cornerPoseAt(rp, travel, s);
        const k = cornerPoseAt(bp, travel, radToDeg(Math.asin(-s / 700)));
        expectNear(k.left.roadWheelDeg, r.left.roadWheelDeg, 0.05, `left wheel at ${s} mm, travel ${travel}`);
        expectNear(k.right.roadWheelDeg, r.right.roadWheelDeg, 0.05, `right wheel at ${s} mm, travel ${travel}`);
        expectNear(k.left.jointAngleDeg, r.left.jointAngleDeg, 0.05, `joint angle at ${s} mm, travel ${travel}`);
      }
    }
  });

  it("the difference shrinks as 1/R (the sagitta): ten times the arm, a tenth of the difference", () => {
    const d = (R: number) => Math.abs(analyzeLayout(bellcrankOf(R), grid).steerLock.static.outerDeg - rack.steerLock.static.outerDeg);
    const d1 = d(700);
    const d2 = d(7000);
    const d3 = d(70000);
    expect(d1).toBeGreaterThan(1e-4);
    expectNear(d1 / d2, 10, 0.1, "700 → 7000 mm");
    expectNear(d2 / d3, 10, 0.1, "7000 → 70000 mm");
  });
});

describe("the bellcrank demo kit", () => {
  it("analyses, draws its pivot and arm, and the pose matches the analysis", () => {
    const a = analyzeLayout(TARNWICK_10_BELLCRANK, { travelSteps: 7, steerSteps: 11 });
    expect(a.steering.input).toEqual({ kind: "bellcrank", unit: "deg", travel: 25 });
    const poser = cornerPoser(TARNWICK_10_BELLCRANK);
    const q = a.steerLock.static.steerInput;
    const p = cornerPoseAt(poser, 0, q);
    expectNear(p.left.roadWheelDeg, a.steerLock.static.innerDeg * Math.sign(a.steering.leftTurnInputSign * q), 1e-6, "inner wheel at lock");
    expect(p.left.bellcrankPivot).toEqual([-5, 35, 36]);
    // The inner ball turned about the pivot by the lock angle: arm length 15 mm kept.
    expectNear(Math.hypot(p.left.tieRodInner[0] + 5, p.left.tieRodInner[1] - 35), 15, 1e-12, "arm length");
    expectNear(radToDeg(Math.atan2(p.left.tieRodInner[1] - 35, p.left.tieRodInner[0] + 5)), -180 + q, 1e-9, "arm angle");
  });
});
