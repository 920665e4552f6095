import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS, TARNWICK_10_BASE, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import { parseLayout, type Layout } from "@/contracts/layout";
import { jointOperatingAngleDeg } from "@/engine/drive/joint-angle";
import { neckContactAngleDeg } from "@/engine/drive/neck-contact";
import { analyzeLayout, GeometryError, type AnalysisResult } from "@/engine/index";
import { degToRad } from "@/engine/math/angle";
import { vec3RotateAboutAxis } from "@/engine/math/rotation";
import { armBallCircle, knuckleRotationForClosureRads, tieRodBranch, tieRodClosure } from "@/engine/steering/linkage";
import { kingpinAxisFromBallJoints, spinAxisFromCamberDeg } from "@/engine/steering/steer-axis";
import { layoutNearDemo } from "./arbitrary-layout";
import { DEG_TOL, expectNear } from "./near";

const GRID = { travelSteps: 25, steerSteps: 41 };

/** Every number in the result is finite; only null marks a missing figure. */
function expectAllFinite(v: unknown, path = "result"): void {
  if (typeof v === "number") expect(Number.isFinite(v), `${path} = ${v}`).toBe(true);
  else if (Array.isArray(v)) v.forEach((x, i) => expectAllFinite(x, `${path}[${i}]`));
  else if (v !== null && typeof v === "object") for (const [k, x] of Object.entries(v)) expectAllFinite(x, `${path}.${k}`);
}

function analyzeOrGeometryError(layout: Layout): AnalysisResult | null {
  try {
    return analyzeLayout(layout, GRID);
  } catch (e) {
    expect(e).toBeInstanceOf(GeometryError);
    return null;
  }
}

describe("demo layouts (acceptance of issue 3)", () => {
  it.each(DEMO_LAYOUTS.map((d) => [d.key, d.layout] as const))("%s parses and analyses with finite results", (_, layout) => {
    expect(parseLayout(layout).ok).toBe(true);
    const r = analyzeLayout(layout, { travelSteps: 41, steerSteps: 61 });
    expectAllFinite(r);
    expect(r.envelope.jointAngleDeg).toHaveLength(41);
    expect(r.envelope.jointAngleDeg[0]).toHaveLength(61);
    expect(r.steerLock.worst.innerDeg).toBeGreaterThan(10);
  });

  it("the baseline's steer lock is set by neck contact, at exactly the §8.1 contact angle", () => {
    const r = analyzeLayout(TARNWICK_10_BASE, GRID);
    expect(r.steerLock.static.limitedBy).toBe("neck-contact");
    expect(r.steerLock.worst.limitedBy).toBe("neck-contact");
    // Neck 5, mouth 8, pivot depth 2 → 29.4471° (REFERENCES §8.2).
    expectNear(r.drive.neckContactAngleDeg!, 29.4471, DEG_TOL, "neck contact angle");
    expectNear(r.steerLock.static.jointAngleDeg, r.drive.neckContactAngleDeg!, 1e-6, "joint angle at lock");
    // A stop with no set-back sits at the contact: the gap (D/2)cos β − a sin β − d/2 (REFERENCES §8.1) is zero there.
    const atContact = analyzeLayout({ ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, stopMarginDeg: 0 } }, GRID);
    expectNear(atContact.steeringStop.clearanceAtStopMm!, 0, 1e-6, "clearance at the limit");
    // The proposed stop (1° of steer short of it) leaves a gap, by the same formula at its joint angle.
    const stop = r.steeringStop;
    const b = (stop.jointAngleAtStopDeg * Math.PI) / 180;
    expectNear(stop.clearanceAtStopMm!, 4 * Math.cos(b) - 2 * Math.sin(b) - 2.5, 1e-12, "gap at the proposed stop");
    expect(stop.clearanceAtStopMm!).toBeGreaterThan(0.02);
    expectNear(stop.angleMarginDeg, r.drive.jointLimitDeg - stop.jointAngleAtStopDeg, 1e-12, "angle margin");
  });

  it("a 4.0 mm neck raises steer lock (now the rated angle binds) and lowers the safety factor", () => {
    const base = analyzeLayout(TARNWICK_10_BASE, GRID);
    const thin = analyzeLayout(TARNWICK_10_THIN_NECK, GRID);
    expect(thin.steerLock.static.innerDeg).toBeGreaterThan(base.steerLock.static.innerDeg);
    expect(thin.steerLock.worst.innerDeg).toBeGreaterThan(base.steerLock.worst.innerDeg);
    expect(thin.steerLock.static.limitedBy).toBe("rated-angle");
    expect(thin.strength.safetyFactor).toBeLessThan(base.strength.safetyFactor);
    // Torsion τ = 16T/(πd³) (Shigley ch. 3 [M]): the factor scales with d³.
    expectNear(thin.strength.safetyFactor / base.strength.safetyFactor, (4 / 5) ** 3, 1e-9, "SF ratio");
  });
});

describe("internal consistency of one analysis", () => {
  const r = analyzeLayout(TARNWICK_10_BASE, GRID);
  const f = TARNWICK_10_BASE.frontView;

  it("the travel row at 0 mm is the static corner: static camber, zero plunge, zero bump steer", () => {
    const row = r.travel.find((t) => Math.abs(t.travelMm) < 1e-9)!;
    expectNear(row.camberDeg, f.staticCamberDeg, 1e-9, "camber");
    expectNear(row.plungeMm, 0, 1e-9, "plunge");
    expectNear(row.bumpSteerDeg, 0, 1e-9, "bump steer");
    expectNear(row.jointAngleDeg, r.drive.staticJointAngleDeg, 1e-9, "joint angle");
  });

  it("roll centre height is measured above the ground under the wheel at that travel (DESIGN.md)", () => {
    for (const t of r.travel) {
      if (t.instantCentreYMm === null || t.rollCentreHeightMm === null) continue;
      const zRcAbsolute = t.contactPatchZMm + ((t.instantCentreZMm! - t.contactPatchZMm) * (0 - t.contactPatchYMm)) / (t.instantCentreYMm - t.contactPatchYMm);
      expectNear(t.rollCentreHeightMm, zRcAbsolute - t.contactPatchZMm, 1e-9, `RC at ${t.travelMm}`);
      // The ground under the wheel moves up with bump (the body sits lower): the contact patch follows the travel.
      expectNear(t.contactPatchZMm, t.travelMm, 0.2, "contact patch height ≈ travel");
    }
  });

  it("joint angles match the drive module's jointOperatingAngleDeg on an independent Rodrigues re-solve (static row)", () => {
    const axis = kingpinAxisFromBallJoints([f.lowerOuter.y, f.lowerOuter.z], [f.upperOuter.y, f.upperOuter.z], 22, -5, f.wheelCentre.z);
    const d = TARNWICK_10_BASE.drive;
    for (const s of r.steering.steps) {
      const phi = degToRad(s.leftKnuckleRotationDeg);
      const o = vec3RotateAboutAxis([0 - axis.point[0], d.outboardJoint.y - axis.point[1], d.outboardJoint.z - axis.point[2]], axis.direction, phi);
      const w = vec3RotateAboutAxis(spinAxisFromCamberDeg(f.staticCamberDeg), axis.direction, phi);
      const shaft = [o[0] + axis.point[0], o[1] + axis.point[1] - d.inboardJoint.y, o[2] + axis.point[2] - d.inboardJoint.z] as const;
      expectNear(s.leftJointAngleDeg, jointOperatingAngleDeg(shaft, w), 1e-9, `joint angle at rack ${s.steerInput}`);
    }
  });

  it("the right wheel, solved as its own mirrored corner (y → −y, same rack motion), matches rightRoadWheelDeg", () => {
    const t = TARNWICK_10_BASE.topView;
    const axisR = kingpinAxisFromBallJoints([-f.lowerOuter.y, f.lowerOuter.z], [-f.upperOuter.y, f.upperOuter.z], 22, -5, f.wheelCentre.z);
    // kingpinAxisFromBallJoints is written for the left corner; mirrored points give the right axis directly.
    const circle = armBallCircle(axisR, [t.steeringArmBall.x, -t.steeringArmBall.y, t.steeringArmBall.z!]);
    const tieRodInner = [t.tieRodInner.x, -t.tieRodInner.y, t.tieRodInner.z!] as const;
    const l = r.steering.tieRodLengthMm;
    const branch = tieRodBranch(tieRodClosure(circle, tieRodInner, l));
    for (const s of r.steering.steps) {
      const phi = knuckleRotationForClosureRads(tieRodClosure(circle, [tieRodInner[0], tieRodInner[1] + s.steerInput, tieRodInner[2]], l), branch)!;
      const fwd = vec3RotateAboutAxis([1, 0, 0], axisR.direction, phi);
      expectNear(s.rightRoadWheelDeg, (Math.atan2(fwd[1], fwd[0]) * 180) / Math.PI, 1e-9, `right wheel at rack ${s.steerInput}`);
    }
  });

  it("Ackermann at lock is P_cot of the lock angles over the kingpin track (DESIGN.md convention)", () => {
    const { innerDeg, outerDeg } = r.steerLock.static;
    const w = r.steerAxis.kingpinTrackMm;
    const expected = ((1 / Math.tan(degToRad(outerDeg)) - 1 / Math.tan(degToRad(innerDeg))) / (w / 280)) * 100;
    expectNear(r.ackermann.atLockPct!, expected, 1e-9, "P_cot at lock");
  });
});

describe("named errors, never NaN", () => {
  it("a neck as wide as the mouth is a shaft-neck error", () => {
    const bad = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: 8 } };
    expect(() => analyzeLayout(bad, GRID)).toThrowError(/shaft neck/);
  });
  it("travel beyond what the arms can reach is a front-suspension error", () => {
    const bad = { ...TARNWICK_10_BASE, frontView: { ...TARNWICK_10_BASE.frontView, bumpTravelMm: 150 } };
    expect(() => analyzeLayout(bad, GRID)).toThrowError(/front suspension: arms cannot close/);
  });
  it("an unknown material id is a material error", () => {
    const bad = { ...TARNWICK_10_BASE, strength: { ...TARNWICK_10_BASE.strength, material: { kind: "catalogue" as const, id: "unobtainium" } } };
    expect(() => analyzeLayout(bad, GRID)).toThrowError(/material/);
  });
  it("grid sizes outside the bounds are refused", () => {
    expect(() => analyzeLayout(TARNWICK_10_BASE, { travelSteps: 1000 })).toThrowError(/travelSteps/);
    expect(() => analyzeLayout(TARNWICK_10_BASE, { steerSteps: 2.5 })).toThrowError(/steerSteps/);
  });
  it("a tie rod that goes over centre within the rack travel is reported as the 'toggle' limit with a sentence", () => {
    // A short steering arm and a long rack stroke: the tie rod goes over centre before the rack ends.
    const layout: Layout = {
      ...TARNWICK_10_BASE,
      topView: { ...TARNWICK_10_BASE.topView, steeringArmBall: { x: -9, y: 104, z: 36 }, steeringInput: { kind: "rack", travelMm: 20 } },
      drive: { ...TARNWICK_10_BASE.drive, jointType: "cv-ball", ratedAngleDeg: 89, cupMouthDiameterMm: 30, pivotDepthMm: 0, neckDiameterMm: 1 },
    };
    const r = analyzeLayout(layout, GRID);
    expect(r.steerLock.static.limitedBy).toBe("toggle");
    expect(r.steeringStop.limitedBy).toBe("toggle");
    expect(r.warnings.some((w) => /^tie rod goes over centre \(in line with the steering arm\) beyond \d+\.\d° of steer/.test(w))).toBe(true);
    expectAllFinite(r);
  });
});

// Many analyses each: on a loaded 2-core machine these take seconds, so they get room (not a speed check).
describe("properties over random layouts near the demo (fast-check)", { timeout: 60_000 }, () => {
  it("no valid layout gives NaN or Infinity: it analyses with finite numbers or throws a GeometryError", () => {
    fc.assert(
      fc.property(layoutNearDemo, (layout) => {
        expect(parseLayout(layout).ok).toBe(true);
        const r = analyzeOrGeometryError(layout);
        if (r) expectAllFinite(r);
      }),
      { numRuns: 60 },
    );
  });

  it("steer lock never passes the joint limit (rated angle or cup): joint angles inside the lock stay within it", () => {
    fc.assert(
      fc.property(layoutNearDemo, (layout) => {
        const r = analyzeOrGeometryError(layout);
        if (!r) return;
        expect(r.drive.jointLimitDeg).toBeLessThanOrEqual(layout.drive.ratedAngleDeg);
        for (const l of [r.steerLock.static, ...r.steerLock.perTravel]) {
          if (l.steerInput !== 0) expect(l.jointAngleDeg).toBeLessThanOrEqual(r.drive.jointLimitDeg + 1e-9);
          // Lock 0: the joint is already past its limit with the wheels straight, and the result says so.
          else expect(r.warnings.some((w) => w.startsWith("drive joint:") && w.includes("already exceeds"))).toBe(true);
        }
        const lockU = Math.abs(r.steerLock.static.steerInput);
        for (const s of r.steering.steps) {
          if (Math.abs(s.steerInput) <= lockU) expect(Math.max(s.leftJointAngleDeg, s.rightJointAngleDeg)).toBeLessThanOrEqual(r.drive.jointLimitDeg + 1e-9);
        }
      }),
      { numRuns: 60 },
    );
  });

  it("a thinner neck never lowers the steer lock (neck-contact limit, REFERENCES §8.1: dβ/dd < 0)", () => {
    fc.assert(
      fc.property(layoutNearDemo, fc.double({ min: 0.05, max: 1.5, noNaN: true }), (layout, thinner) => {
        const d = layout.drive;
        if (d.neckDiameterMm - thinner < 0.5) return;
        const thin: Layout = { ...layout, drive: { ...d, neckDiameterMm: d.neckDiameterMm - thinner } };
        expect(neckContactAngleDeg({ mouthDiameterMm: d.cupMouthDiameterMm, neckDiameterMm: thin.drive.neckDiameterMm, pivotDepthMm: d.pivotDepthMm })).toBeGreaterThan(
          neckContactAngleDeg({ mouthDiameterMm: d.cupMouthDiameterMm, neckDiameterMm: d.neckDiameterMm, pivotDepthMm: d.pivotDepthMm }),
        );
        const a = analyzeOrGeometryError(layout);
        const b = analyzeOrGeometryError(thin);
        if (!a || !b) return;
        expect(b.steerLock.static.innerDeg).toBeGreaterThanOrEqual(a.steerLock.static.innerDeg - 1e-9);
        expect(b.steerLock.worst.innerDeg).toBeGreaterThanOrEqual(a.steerLock.worst.innerDeg - 1e-9);
        b.steerLock.perTravel.forEach((l, i) => expect(l.innerDeg).toBeGreaterThanOrEqual(a.steerLock.perTravel[i].innerDeg - 1e-9));
      }),
      { numRuns: 40 },
    );
  });

  it("a layout mirrored fore–aft (x → −x, zero caster) gives the same joint angles and camber with the road-wheel angles mirrored", () => {
    fc.assert(
      fc.property(layoutNearDemo, (layout0) => {
        const layout: Layout = { ...layout0, sideView: { casterDeg: 0, casterOffsetMm: 0 } };
        const t = layout.topView;
        const mirrored: Layout = {
          ...layout,
          topView: { ...t, steeringArmBall: { ...t.steeringArmBall, x: -t.steeringArmBall.x }, tieRodInner: { ...t.tieRodInner, x: -t.tieRodInner.x } },
        };
        const a = analyzeOrGeometryError(layout);
        const b = analyzeOrGeometryError(mirrored);
        if (!a || !b) return;
        expect(b.steering.leftTurnInputSign).toBe(-a.steering.leftTurnInputSign);
        a.steering.steps.forEach((s, i) => {
          const m = b.steering.steps[i];
          expectNear(m.leftRoadWheelDeg, -s.leftRoadWheelDeg, 1e-9, "road angle mirrored");
          expectNear(m.leftJointAngleDeg, s.leftJointAngleDeg, 1e-9, "joint angle");
          expectNear(m.leftCamberDeg, s.leftCamberDeg, 1e-9, "camber");
        });
        // The left turn of the mirrored car is the right turn of the original: same rack stroke and joint
        // angle, but its inner wheel is the original's outer one (Ackermann becomes reverse Ackermann).
        expectNear(b.steerLock.static.steerInput, -a.steerLock.static.steerInput, 1e-6, "lock rack");
        expectNear(b.steerLock.static.innerDeg, a.steerLock.static.outerDeg, 1e-6, "lock inner ↔ outer");
        expectNear(b.steerLock.static.outerDeg, a.steerLock.static.innerDeg, 1e-6, "lock outer ↔ inner");
        expectNear(b.steerLock.static.jointAngleDeg, a.steerLock.static.jointAngleDeg, 1e-6, "joint angle at lock");
      }),
      { numRuns: 40 },
    );
  });
});

describe("figures at ride height", () => {
  it("atStatic is the travel-0 row of a grid that has one, and reproduces the input's static camber", () => {
    // droop 10 mm, bump 14 mm: 13 steps of 2 mm put one step exactly on 0.
    const a = analyzeLayout(TARNWICK_10_BASE, { travelSteps: 13, steerSteps: 9 });
    const row = a.travel.find((t) => Math.abs(t.travelMm) < 1e-12);
    expect(row).toBeDefined();
    expect(a.atStatic.travelMm).toBe(0);
    for (const key of Object.keys(row!) as (keyof typeof row)[]) {
      const v = a.atStatic[key!] as number | null;
      const w = row![key!] as number | null;
      if (v === null || w === null) expect(v).toBe(w);
      else expectNear(v, w, 1e-9);
    }
    // Input echo (common practice): the static pose is the layout itself, so its camber is the static camber.
    expectNear(a.atStatic.camberDeg, TARNWICK_10_BASE.frontView.staticCamberDeg, DEG_TOL);
  });

  it("exists for a grid without a step at 0", () => {
    const a = analyzeLayout(TARNWICK_10_BASE, { travelSteps: 2, steerSteps: 3 });
    expect(a.travel.map((t) => t.travelMm)).toEqual([-10, 14]);
    expect(a.atStatic.travelMm).toBe(0);
    expect(Number.isFinite(a.atStatic.rollCentreHeightMm ?? Number.NaN)).toBe(true);
  });
});
