import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS, TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { analyzeLayout, cornerPoseAt, cornerPoser, wheelAxesMeet, type WheelPose } from "@/engine/index";
import { degToRad } from "@/engine/math/angle";
import { expectGeometryError, expectNear } from "./near";

// The pose the editor draws must be the pose the analysis solved: the same joint angle, road-wheel angle
// and camber at every grid point (the analysis is the reference here; its own checks cite their sources).
describe("cornerPoseAt agrees with analyzeLayout", () => {
  it.each(DEMO_LAYOUTS.map((d) => [d.key, d.layout] as const))("%s: envelope points, travel figures and the static pose", (_, layout) => {
    const a = analyzeLayout(layout, { travelSteps: 7, steerSteps: 9 });
    const poser = cornerPoser(layout);
    a.envelope.travelMm.forEach((t, i) => {
      a.envelope.steerInput.forEach((s, j) => {
        const joint = a.envelope.jointAngleDeg[i]![j];
        const p = cornerPoseAt(poser, t, s);
        if (joint === null) {
          expect(p.left.steerSolved).toBe(false);
          return;
        }
        expect(p.left.steerSolved).toBe(true);
        // The envelope is rounded to 1e-4°.
        expectNear(p.left.jointAngleDeg, joint, 1e-4, `joint at travel ${t}, rack ${s}`);
        expectNear(p.left.roadWheelDeg, a.envelope.leftRoadWheelDeg[i]![j]!, 1e-4, `road wheel at travel ${t}, rack ${s}`);
      });
      const p0 = cornerPoseAt(poser, t, 0);
      const row = a.travel[i]!;
      // Rack centred, the knuckle still turns by the bump steer; the drawing includes it.
      expectNear(p0.left.roadWheelDeg, row.bumpSteerDeg, 1e-9, `bump steer at ${t}`);
      expectNear(p0.left.jointAngleDeg, row.jointAngleDeg, 1e-9, "joint angle, rack centred");
      if (row.rollCentreHeightMm !== null) expectNear(p0.rollCentre![1] - row.contactPatchZMm, row.rollCentreHeightMm, 1e-9, "roll centre height");
    });
    // At ride height there is no bump steer: the front-view figures are the drawing's.
    const st = cornerPoseAt(poser, 0, 0).left;
    expectNear(st.camberDeg, a.atStatic.camberDeg, 1e-9, "static camber");
    expectNear(st.contactPatch[1], a.atStatic.contactPatchYMm, 1e-9, "contact patch y");
    expectNear(st.contactPatch[2], a.atStatic.contactPatchZMm, 1e-9, "contact patch z");
    expectNear(st.kingpinGround[1], a.atStatic.contactPatchYMm - a.steerAxis.scrubRadiusMm, 1e-9, "kingpin ground point = contact − scrub radius");
    expectNear(st.kingpinGround[0], st.contactPatch[0] + a.steerAxis.casterTrailMm, 1e-9, "kingpin ground point = contact + trail");
  });

  it("the static pose is the layout as drawn", () => {
    const l = TARNWICK_10_BASE;
    const p = cornerPoseAt(cornerPoser(l), 0, 0);
    expectNear(p.left.lowerOuter[1], l.frontView.lowerOuter.y, 1e-9, "lower ball joint y");
    expectNear(p.left.upperOuter[2], l.frontView.upperOuter.z, 1e-9, "upper ball joint z");
    expectNear(p.left.wheelCentre[1], l.frontView.wheelCentre.y, 1e-9, "wheel centre y");
    expectNear(p.left.steeringArmBall[0], l.topView.steeringArmBall.x, 1e-9, "arm ball x");
    expectNear(p.left.outboardJoint[1], l.drive.outboardJoint.y, 1e-9, "outboard joint y");
    expectNear(p.left.knuckleRotationDeg, 0, 1e-9, "no steer");
  });

  it("the right wheel is the left one solved at the opposite rack position, mirrored", () => {
    const poser = cornerPoser(TARNWICK_10_BASE);
    const p = cornerPoseAt(poser, 4, 6);
    const q = cornerPoseAt(poser, 4, -6);
    expectNear(p.right.roadWheelDeg, -q.left.roadWheelDeg, 1e-12, "road wheel");
    expectNear(p.right.wheelCentre[1], -q.left.wheelCentre[1], 1e-12, "wheel centre y");
    expectNear(p.right.jointAngleDeg, q.left.jointAngleDeg, 1e-12, "joint angle");
  });

  it("the tie rod keeps its length at every pose (fixed-length tie rod)", () => {
    const poser = cornerPoser(TARNWICK_10_BASE);
    for (const [t, s] of [[-8, -4], [0, 5], [12, 9.5], [6, -7]] as const) {
      const w = cornerPoseAt(poser, t, s).left;
      expect(w.steerSolved).toBe(true);
      const len = Math.hypot(w.steeringArmBall[0] - w.tieRodInner[0], w.steeringArmBall[1] - w.tieRodInner[1], w.steeringArmBall[2] - w.tieRodInner[2]);
      expectNear(len, poser.tieRodLengthMm, 1e-9, `tie rod at ${t}, ${s}`);
    }
  });

  it("a travel the arms cannot reach is a named error", () => {
    expectGeometryError(() => cornerPoseAt(cornerPoser(TARNWICK_10_BASE), 400, 0), "front suspension");
  });
});

function wheel(x: number, y: number, headingDeg: number): WheelPose {
  const h = degToRad(headingDeg);
  return { wheelCentre: [x, y, 40], forward: [Math.cos(h), Math.sin(h), 0] } as unknown as WheelPose;
}

describe("wheelAxesMeet", () => {
  it("meets on the rear axle line for angles that satisfy cot δo − cot δi = w/L (Ackermann's condition, DESIGN.md convention; Milliken & Milliken ch. 19, from memory)", () => {
    const w = 240;
    const L = 280;
    const inner = 30;
    const outer = (Math.atan(1 / (1 / Math.tan(degToRad(inner)) + w / L)) * 180) / Math.PI;
    // Left turn: the left wheel is inner.
    const meet = wheelAxesMeet(wheel(0, w / 2, inner), wheel(0, -w / 2, outer))!;
    expectNear(meet[0], -L, 1e-9, "x of the turn centre");
    expectNear(meet[1], w / 2 + L / Math.tan(degToRad(inner)), 1e-9, "y of the turn centre");
  });

  it("is null for parallel wheels", () => {
    expect(wheelAxesMeet(wheel(0, 120, 0), wheel(0, -120, 0))).toBeNull();
    expect(wheelAxesMeet(wheel(0, 120, 15), wheel(0, -120, 15))).toBeNull();
  });
});
