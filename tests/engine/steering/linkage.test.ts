import { describe, expect, it } from "vitest";
import { degToRad, radToDeg } from "@/engine/math/angle";
import type { Vec3 } from "@/engine/math/vec3";
import { ackermannInnerReferencePercent, ackermannOuterReferencePercent, ackermannTurnCentrePercent } from "@/engine/steering/ackermann";
import {
  armBallAt,
  armBallCircle,
  knuckleRotationForClosureRads,
  knuckleRotationForRackRads,
  rackLinkage,
  rackReachMargin,
  tieRodBranch,
  tieRodClosure,
  type ArmBallCircle,
} from "@/engine/steering/linkage";
import { DEG_TOL, expectNear } from "../near";

/**
 * The symmetric single-tie-rod trapezoid of REFERENCES §2.5 built from the engine's 3-D linkage parts:
 * vertical kingpins at y = ±w/2, arms of length d pointing rearward and inboard at βa, tie rod l
 * (default w − 2d sin βa). For a left turn the left knuckle turns by δi; the right knuckle's rotation is
 * solved with the tie rod's far end fixed at the left arm ball.
 */
function trapezoid(w: number, d: number, betaDeg: number, l = w - 2 * d * Math.sin(degToRad(betaDeg))) {
  const b = degToRad(betaDeg);
  const up: Vec3 = [0, 0, 1];
  const left: ArmBallCircle = armBallCircle({ point: [0, w / 2, 0], direction: up }, [-d * Math.cos(b), w / 2 - d * Math.sin(b), 0]);
  const right: ArmBallCircle = armBallCircle({ point: [0, -w / 2, 0], direction: up }, [-d * Math.cos(b), -w / 2 + d * Math.sin(b), 0]);
  const staticClosure = tieRodClosure(right, armBallAt(left, 0), l);
  const closes = knuckleRotationForClosureRads(staticClosure, 1) !== null;
  const branch = closes ? tieRodBranch(staticClosure) : 1;
  /** Outer (right) road-wheel angle in degrees, + left, for inner angle δi; null where the rod cannot reach. */
  const outerDeg = (innerDeg: number): number | null => {
    const phi = knuckleRotationForClosureRads(tieRodClosure(right, armBallAt(left, degToRad(innerDeg)), l), branch);
    return phi === null ? null : radToDeg(phi);
  };
  return { outerDeg, closes };
}

describe("steering trapezoid solved by the tie-rod closure (REFERENCES §2.5; Jazar ch. 7 [M])", () => {
  const t = trapezoid(200, 25, 21.0375);
  it.each([
    [10, 9.3025, 53.14, 59.4, 56.38],
    [20, 17.2831, 54.74, 65.84, 60.64],
    [30, 23.9148, 60.69, 74.13, 67.99],
    [40, 29.0493, 72.66, 84.36, 79.12],
  ])("classic-rule arms, δi %d° → δo %d°; P_out %d %, P_in %d %, P_cot %d %", (di, dO, pOut, pIn, pCot) => {
    const o = t.outerDeg(di)!;
    expectNear(o, dO, DEG_TOL, "δo");
    expectNear(ackermannOuterReferencePercent(di, o, 200, 260), pOut, 0.006, "P_out");
    expectNear(ackermannInnerReferencePercent(di, o, 200, 260), pIn, 0.006, "P_in");
    expectNear(ackermannTurnCentrePercent(di, o, 200, 260), pCot, 0.006, "P_cot");
  });

  it("the classic arm rule gives ≈ 55 %, not 100 %, near centre (P_cot limit 54.930 %, §2.5 [D])", () => {
    const di = 0.02;
    expectNear(ackermannTurnCentrePercent(di, t.outerDeg(di)!, 200, 260), 54.93, 0.005, "P_cot → 54.930 %");
    expectNear(ackermannTurnCentrePercent(di, trapezoid(200, 10, 21.0375).outerDeg(di)!, 200, 260), 51.86, 0.005, "d = 10");
    expectNear(ackermannTurnCentrePercent(di, trapezoid(200, 50, 21.0375).outerDeg(di)!, 200, 260), 60.94, 0.005, "d = 50");
  });

  it("toggle: no assembly beyond δi = 171.9368° (d 25, βa 21.0375°, l 182.051)", () => {
    expect(t.outerDeg(171.93)).not.toBeNull();
    expect(t.outerDeg(171.94)).toBeNull();
    const u = trapezoid(200, 60, 30, 140);
    expect(u.outerDeg(141.37)).not.toBeNull();
    expect(u.outerDeg(141.38)).toBeNull();
  });

  it("a 100 mm tie rod cannot be assembled at any angle (192.445 mm > l + d, §2.5)", () => {
    const short = trapezoid(200, 25, 21.0375, 100);
    expect(short.closes).toBe(false);
    for (let di = -60; di <= 60; di += 5) expect(short.outerDeg(di)).toBeNull();
  });

  // Own worked case, constructed by hand from Jazar's trapezoid relation (Vehicle Dynamics 2nd ed. ch. 7 [M],
  // REFERENCES §2.5): w 1460, d 130, βa 12°; δo found by bisection on that relation (python), independently
  // of the circle closure used here.
  it("own case: full-size trapezoid w 1460, d 130, βa 12° → δo 9.6241° at 10°, 22.6275° at 25°", () => {
    const j = trapezoid(1460, 130, 12);
    expectNear(j.outerDeg(10)!, 9.6241, DEG_TOL, "δo at 10°");
    expectNear(j.outerDeg(25)!, 22.6275, DEG_TOL, "δo at 25°");
  });
});

describe("rack linkage", () => {
  // Knuckle axis vertical at (0, 100, 0); arm ball 15 mm behind it; rack end 60 mm inboard of the ball.
  const circle = armBallCircle({ point: [0, 100, 0], direction: [0, 0, 1] }, [-15, 100, 0]);
  const rackEnd: Vec3 = [-15, 40, 0];
  const l = 60;
  const lk = rackLinkage(circle, rackEnd, l, tieRodBranch(tieRodClosure(circle, rackEnd, l)));

  it("keeps the tie rod at its length for every rack position it reaches", () => {
    for (let s = -12; s <= 12; s += 1.5) {
      const phi = knuckleRotationForRackRads(lk, s);
      expect(phi).not.toBeNull();
      const ball = armBallAt(circle, phi!);
      expectNear(Math.hypot(ball[0] - rackEnd[0], ball[1] - (rackEnd[1] + s), ball[2] - rackEnd[2]), l, 1e-9, `tie-rod length at ${s}`);
    }
    expectNear(knuckleRotationForRackRads(lk, 0)!, 0, 1e-12, "straight ahead at centre rack");
  });

  it("arm behind the axle: pushing the rack to +y turns the left wheel right (rotation −)", () => {
    expect(knuckleRotationForRackRads(lk, 3)!).toBeLessThan(0);
    // Small rack moves turn the knuckle by about s / arm length (rad): common practice lever rule.
    expectNear(knuckleRotationForRackRads(lk, 0.01)!, -0.01 / 15, 1e-6, "lever rule");
  });

  it("runs out of reach (margin < 0) when the rack pulls past the arm's reach", () => {
    expect(rackReachMargin(lk, 0)).toBeGreaterThan(0);
    expect(rackReachMargin(lk, -40)).toBeLessThan(0);
    expect(knuckleRotationForRackRads(lk, -40)).toBeNull();
  });

  it("an arm ball on the kingpin axis is a named error", () => {
    expect(() => armBallCircle({ point: [0, 100, 0], direction: [0, 0, 1] }, [0, 100, 20])).toThrowError(/steering arm/);
  });
});
