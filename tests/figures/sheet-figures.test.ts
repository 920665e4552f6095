// The sheet's tables come from the readouts themselves: the same labels, values and hints, plus the strength
// figures spelled out; the inputs are the property panel's fields that apply to the layout.
import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { analyzeLayout } from "@/engine";
import { readoutGroups } from "@/figures/readout-figures";
import { inputGroups, sheetFigureGroups } from "@/figures/sheet-figures";

const a = analyzeLayout(TARNWICK_10_BASE, { travelSteps: 21, steerSteps: 41 });

describe("sheetFigureGroups", () => {
  it("holds every readout unchanged, in order, and adds shaft torque, shear stress and the allowable", () => {
    for (const unit of ["mm", "in"] as const) {
      const readouts = readoutGroups(a, unit).flatMap((g) => g.readouts);
      const sheet = sheetFigureGroups(a, unit).flatMap((g) => g.readouts);
      expect(sheet.slice(0, readouts.length)).toEqual(readouts);
      expect(sheet.slice(readouts.length).map((r) => r.id)).toEqual(["shaft-torque", "shear-stress", "allowable-shear"]);
    }
    const strength = sheetFigureGroups(a, "mm").find((g) => g.id === "strength")!.readouts;
    expect(strength.find((r) => r.id === "shaft-torque")!.value).toBe(`${a.strength.shaftTorqueNmm.toFixed(0)} N·mm`);
    expect(strength.find((r) => r.id === "allowable-shear")!.value).toBe(`${a.strength.allowableShearMpa.toFixed(0)} MPa`);
  });
});

describe("inputGroups", () => {
  it("shows the fields that apply (a Kv motor, not a torque one) with lengths in the unit", () => {
    const groups = inputGroups(TARNWICK_10_BASE, "in");
    const rows = groups.flatMap((g) => g.rows);
    const byPath = (p: string) => rows.find((r) => r.path === p);
    expect(byPath("strength.motor.kvRpmPerV")?.value).toBe("4000 rpm/V");
    expect(byPath("strength.motor.torqueNm")).toBeUndefined();
    // 30 mm is 1.1811 in (1 in = 25.4 mm exactly).
    expect(byPath("frontView.lowerInner.y")?.value).toBe("1.1811 in");
    expect(byPath("frontView.staticCamberDeg")?.value).toBe("-1.00°");
    expect(byPath("drive.boreDiameterMm")?.value).toBe("— (solid)");
    expect(byPath("drive.jointType")?.value).toBe("Dogbone (pin in cup)");
    expect(byPath("strength.gearRatios")?.value).toBe("3.455 × 2.600");
  });
});
