import fc from "fast-check";
import { Quaternion, Vector3 } from "three";
import { expectGeometryError } from "../near";
import { describe, expect, it } from "vitest";
import { GeometryError } from "@/engine/errors";
import {
  jointAngleFromInclinationAndSteerDeg,
  jointOperatingAngleDeg,
  steerForJointAngleDeg,
} from "@/engine/drive/joint-angle";

const ANGLE_TOL_DEG = 1e-3;


describe("joint angle from shaft inclination and steer — REFERENCES §1.5 check cases (derived [D])", () => {
  it.each([
    { alpha: 10, delta: 30, beta: 31.4749 },
    { alpha: 5, delta: 45, beta: 45.2176 },
    { alpha: 15, delta: 20, beta: 24.8142 },
  ])("α=$alpha° δ=$delta° → β=$beta°", ({ alpha, delta, beta }) => {
    expect(Math.abs(jointAngleFromInclinationAndSteerDeg(alpha, delta) - beta)).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(jointAngleFromInclinationAndSteerDeg(alpha, -delta) - beta)).toBeLessThan(ANGLE_TOL_DEG);
    // the inverse returns the steer that reaches that joint angle
    expect(Math.abs(steerForJointAngleDeg(alpha, beta) - delta)).toBeLessThan(ANGLE_TOL_DEG);
  });

  it("max steer from an articulation limit: β_max 29.4471° (REFERENCES §8.2) with α = 10° gives arccos(cos β / cos α)", () => {
    // derived, REFERENCES §8.1 "Max steer from the articulation limit" [D]; value worked separately in python3 from that formula: cos 29.4471° / cos 10° = 0.884244
    expect(Math.abs(steerForJointAngleDeg(10, 29.4471) - 27.8414)).toBeLessThan(ANGLE_TOL_DEG);
  });

  it("no inclination: the joint angle is the steer angle; no steer: it is the inclination", () => {
    expect(jointAngleFromInclinationAndSteerDeg(0, 37)).toBeCloseTo(37, 10);
    expect(jointAngleFromInclinationAndSteerDeg(12, 0)).toBeCloseTo(12, 10);
    expect(steerForJointAngleDeg(12, 12)).toBeCloseTo(0, 5);
  });

  it("a rated angle below the straight-ahead inclination is a named error", () => {
    expectGeometryError(() => steerForJointAngleDeg(15, 10), "drive joint");
    expectGeometryError(() => steerForJointAngleDeg(90, 10), "drive joint");
    expectGeometryError(() => jointAngleFromInclinationAndSteerDeg(Number.NaN, 10), "drive joint");
    expectGeometryError(() => jointAngleFromInclinationAndSteerDeg(10, 200), "drive joint");
  });
});

describe("operating angle between shaft and stub axle", () => {
  it("is the angle between the vectors, whatever their length", () => {
    expect(jointOperatingAngleDeg([0, 1, 0], [0, 5, 0])).toBe(0);
    expect(jointOperatingAngleDeg([0, 2, 0], [3, 0, 0])).toBeCloseTo(90, 12);
    expect(jointOperatingAngleDeg([0, 1, 0], [0, -1, 0])).toBeCloseTo(180, 12);
    expect(jointOperatingAngleDeg([1, 1, 0], [1, 0, 0])).toBeCloseTo(45, 12);
  });

  it("stays accurate for tiny angles where arccos of the dot product loses digits", () => {
    const tiny = 1e-7; // radians
    const angle = jointOperatingAngleDeg([0, 1, 0], [0, Math.cos(tiny), Math.sin(tiny)]);
    expect(Math.abs(angle / ((tiny * 180) / Math.PI) - 1)).toBeLessThan(1e-6);
  });

  it("matches three.js Vector3.angleTo on a steered, inclined corner (independent library)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -30, max: 30, noNaN: true }),
        fc.double({ min: -50, max: 50, noNaN: true }),
        fc.double({ min: 0, max: 30, noNaN: true }),
        (alpha, steer, kpi) => {
          const rad = Math.PI / 180;
          const shaft = new Vector3(0, Math.cos(alpha * rad), Math.sin(alpha * rad));
          // stub axle steered about a kingpin axis leaning inboard by kpi
          const kingpin = new Vector3(0, -Math.sin(kpi * rad), Math.cos(kpi * rad));
          const stub = new Vector3(0, 1, 0).applyQuaternion(new Quaternion().setFromAxisAngle(kingpin, steer * rad));
          const ours = jointOperatingAngleDeg([shaft.x, shaft.y, shaft.z], [stub.x, stub.y, stub.z]);
          return Math.abs(ours - shaft.angleTo(stub) / rad) < 1e-6;
        },
      ),
    );
  });

  it("rejects zero-length and non-finite directions", () => {
    expectGeometryError(() => jointOperatingAngleDeg([0, 0, 0], [0, 1, 0]), "drive shaft");
    expectGeometryError(() => jointOperatingAngleDeg([0, 1, 0], [0, Number.NaN, 0]), "stub axle");
  });

  it("never returns NaN for finite directions (fast-check)", () => {
    const c = fc.double({ min: -1e6, max: 1e6, noNaN: true });
    fc.assert(
      fc.property(fc.tuple(c, c, c), fc.tuple(c, c, c), (s, w) => {
        try {
          const angle = jointOperatingAngleDeg(s, w);
          return Number.isFinite(angle) && angle >= 0 && angle <= 180;
        } catch (error) {
          return error instanceof GeometryError;
        }
      }),
    );
  });

  it("the idealised joint angle is never below the inclination and grows with steer (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: -80, max: 80, noNaN: true }), fc.double({ min: 0, max: 89, noNaN: true }), (alpha, delta) => {
        const b1 = jointAngleFromInclinationAndSteerDeg(alpha, delta);
        const b2 = jointAngleFromInclinationAndSteerDeg(alpha, delta + 1);
        return b1 >= Math.abs(alpha) - 1e-9 && b2 >= b1 - 1e-9;
      }),
    );
  });
});
