import { describe, expect, it } from "vitest";
import { GeometryError } from "@/engine/errors";
import { DRIVE_JOINT_KINDS, DRIVE_JOINT_TYPES, driveJointType } from "@/engine/drive/joint-types";

describe("drive joint kinds — REFERENCES §1.6", () => {
  it("lists every kind with a typical angle inside its range", () => {
    expect(Object.keys(DRIVE_JOINT_TYPES).sort()).toEqual([...DRIVE_JOINT_KINDS].sort());
    for (const kind of DRIVE_JOINT_KINDS) {
      const t = driveJointType(kind);
      expect(t.kind).toBe(kind);
      expect(t.typicalRatedAngleDeg).toBeGreaterThanOrEqual(t.ratedAngleRangeDeg[0]);
      expect(t.typicalRatedAngleDeg).toBeLessThanOrEqual(t.ratedAngleRangeDeg[1]);
    }
  });

  it("the fixed ball CV figure is the published one: 45–48° (Wikipedia 'Constant-velocity joint', citing NTN Technical Review No. 75)", () => {
    const cv = driveJointType("cv-ball");
    expect(cv.ratedAngleRangeDeg).toEqual([45, 48]);
    expect(cv.ratedAngleSource.cites).toEqual(["cv-joint-wikipedia"]);
    expect(cv.hasSpeedFluctuation).toBe(false);
  });

  it("RC joint figures have no published source and say so: common practice, recalled", () => {
    for (const kind of ["dogbone", "cvd", "single-cardan", "double-cardan"] as const) {
      expect(driveJointType(kind).ratedAngleSource.cites).toEqual(["common-practice"]);
      expect(driveJointType(kind).ratedAngleSource.note).toMatch(/no published source/);
    }
    expect(driveJointType("dogbone").ratedAngleRangeDeg).toEqual([25, 35]);
    expect(driveJointType("double-cardan").ratedAngleRangeDeg).toEqual([50, 60]);
  });

  it("a single cardan fluctuates, a centred double cardan does not; a dogbone plunges (REFERENCES §1.1–1.2 [D], §1.6 [C])", () => {
    expect(driveJointType("single-cardan").hasSpeedFluctuation).toBe(true);
    expect(driveJointType("double-cardan").hasSpeedFluctuation).toBe(false);
    expect(driveJointType("dogbone").plunges).toBe(true);
    expect(driveJointType("cv-ball").plunges).toBe(false);
  });

  it("an unknown kind is a named error", () => {
    expect(() => driveJointType("rubber-band" as never)).toThrow(GeometryError);
    expect(() => driveJointType("toString" as never)).toThrow(GeometryError);
  });
});
