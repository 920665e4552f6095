import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { layoutFieldsSchema } from "@/contracts/layout";
import { moveHandle, nudgeHandle, setNeckDiameter } from "@/editor/commands/edit-commands";
import { handleById, handlePlanePoint, HANDLES } from "@/editor/document/handles";
import { ALL_FIELDS, fieldRange, layoutMessageInWords } from "@/figures/layout-fields";
import { layoutSchema } from "@/contracts/layout";
import { getAt, setAt } from "@/figures/layout-paths";

describe("layout paths", () => {
  it("reads and writes a nested field without touching the rest", () => {
    const next = setAt(TARNWICK_10_BASE, "frontView.lowerOuter.y", 111);
    expect(getAt(next, "frontView.lowerOuter.y")).toBe(111);
    expect(TARNWICK_10_BASE.frontView.lowerOuter.y).toBe(110);
    expect(next.drive).toBe(TARNWICK_10_BASE.drive);
    expect(next.frontView.upperOuter).toBe(TARNWICK_10_BASE.frontView.upperOuter);
  });

  it("removes an optional field with undefined and keeps identity when nothing changes", () => {
    const without = setAt(TARNWICK_10_BASE, "sideView.casterOffsetMm", undefined);
    expect("casterOffsetMm" in without.sideView).toBe(false);
    expect(setAt(TARNWICK_10_BASE, "frontView.lowerOuter.y", 110)).toBe(TARNWICK_10_BASE);
  });
});

describe("handles", () => {
  it("every handle reads a point of the layout, and every layout point with two coordinates in a view has a handle", () => {
    for (const h of HANDLES) {
      const [u, v] = handlePlanePoint(TARNWICK_10_BASE, h);
      expect(Number.isFinite(u) && Number.isFinite(v), h.id).toBe(true);
    }
    expect(HANDLES.filter((h) => h.view === "front").map((h) => h.id.split(":")[1])).toEqual(["lowerInner", "lowerOuter", "upperInner", "upperOuter", "wheelCentre", "inboardJoint", "outboardJoint"]);
    expect(HANDLES.filter((h) => h.view === "top").map((h) => h.id.split(":")[1])).toEqual(["steeringArmBall", "rackEnd", "inboardJoint", "outboardJoint"]);
  });

  it("the top view draws forward down the screen: plane v = −x", () => {
    const h = handleById("top:steeringArmBall")!;
    expect(handlePlanePoint(TARNWICK_10_BASE, h)).toEqual([100, 18]);
    // An absent x (the joints' default) reads as 0.
    expect(handlePlanePoint(TARNWICK_10_BASE, handleById("top:outboardJoint")!)).toEqual([106.6, 0]);
  });
});

describe("edit commands", () => {
  it("moving a handle writes its two coordinates and leaves the third", () => {
    const next = moveHandle(TARNWICK_10_BASE, "top:steeringArmBall", 98, 20);
    expect(next.topView.steeringArmBall).toEqual({ x: -20, y: 98, z: 36 });
    const front = moveHandle(TARNWICK_10_BASE, "front:lowerOuter", 112, 21.5);
    expect(front.frontView.lowerOuter).toEqual({ y: 112, z: 21.5 });
  });

  it("keeps every coordinate inside the contract's range", () => {
    const next = moveHandle(TARNWICK_10_BASE, "front:lowerInner", 5000, -900);
    expect(next.frontView.lowerInner).toEqual({ y: 1000, z: -300 });
    expect(layoutFieldsSchema.safeParse(next).success).toBe(true);
  });

  it("nudges by plane steps without binary noise", () => {
    let l = TARNWICK_10_BASE;
    for (let i = 0; i < 3; i++) l = nudgeHandle(l, "front:upperOuter", 0.1, 0);
    expect(l.frontView.upperOuter.y).toBe(105.2);
  });

  it("sets the neck from a picked diameter, rounded and in range", () => {
    expect(setNeckDiameter(TARNWICK_10_BASE, 4.2500000001).drive.neckDiameterMm).toBe(4.25);
    expect(setNeckDiameter(TARNWICK_10_BASE, 0.01).drive.neckDiameterMm).toBe(0.3);
  });
});

describe("field table", () => {
  it("has a range from the contract for every number field", () => {
    for (const f of ALL_FIELDS) {
      if (["length", "angle", "number", "integer"].includes(f.kind)) expect(fieldRange(f.path), f.path).not.toBeNull();
    }
    expect(fieldRange("drive.neckDiameterMm")).toEqual({ min: 0.3, max: 100 });
    expect(fieldRange("strength.motor.kvRpmPerV")).toEqual({ min: 50, max: 50000 });
    expect(fieldRange("strength.gearRatios")).toEqual({ min: 0.1, max: 100 });
  });
});

describe("contract messages in the panel's words", () => {
  it("names every field by its label, never by its dotted path", () => {
    expect(layoutMessageInWords("drive.neckDiameterMm must be smaller than drive.cupMouthDiameterMm")).toBe("Neck diameter must be smaller than cup mouth diameter");
    expect(layoutMessageInWords("topView.rackEnd must be at least 1 mm from topView.steeringArmBall (the tie rod has a length)")).not.toMatch(/topView\./);
    expect(layoutMessageInWords("a path we do not know: drive.nothingHere stays")).toBe("a path we do not know: drive.nothingHere stays");
  });

  it("leaves no dotted path in any cross-field message the contract writes", () => {
    const broken = [
      setAt(TARNWICK_10_BASE, "frontView.lowerOuter.y", TARNWICK_10_BASE.frontView.lowerInner.y - 1),
      setAt(TARNWICK_10_BASE, "frontView.upperOuter.z", TARNWICK_10_BASE.frontView.lowerOuter.z - 1),
      setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 9),
      setAt(TARNWICK_10_BASE, "drive.outboardJoint.y", TARNWICK_10_BASE.drive.inboardJoint.y - 1),
      setAt(TARNWICK_10_BASE, "topView.rackEnd", TARNWICK_10_BASE.topView.steeringArmBall),
    ];
    for (const layout of broken) {
      const result = layoutSchema.safeParse(layout);
      expect(result.success).toBe(false);
      for (const issue of result.error!.issues) expect(layoutMessageInWords(issue.message), issue.message).not.toMatch(/\b(frontView|sideView|topView|drive|strength)\.[A-Za-z]/);
    }
  });
});
