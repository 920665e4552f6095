import { describe, expect, it } from "vitest";
import { gridStepLabel, GRID_STEPS_MM, nudgeDelta, snapToStep } from "@/editor/tools/snapping";
import { formatLength, MM_PER_INCH, mmToUnit, unitToMm } from "@/figures/length-unit";

describe("snapping", () => {
  it("snaps to the nearest multiple of the step", () => {
    expect(snapToStep(12.26, 0.5)).toBe(12.5);
    expect(snapToStep(12.24, 0.5)).toBe(12);
    expect(snapToStep(-3.3, 0.25)).toBe(-3.25);
    expect(snapToStep(0.3, 0.1)).toBe(0.3);
    expect(snapToStep(7.77, 0)).toBe(7.77);
  });

  it("snaps to binary fractions of an inch", () => {
    const step = GRID_STEPS_MM.in[1]!; // 1/32 in
    expect(gridStepLabel(step, "in")).toBe("1/32 in");
    expect(snapToStep(10, step)).toBeCloseTo(13 * step, 9); // 10 mm ≈ 12.6 × 0.79375 mm
  });

  it("nudges one step, ten with Shift, up = +v", () => {
    expect(nudgeDelta("ArrowUp", false, 0.5)).toEqual([0, 0.5]);
    expect(nudgeDelta("ArrowLeft", true, 0.5)).toEqual([-5, 0]);
    expect(nudgeDelta("a", false, 0.5)).toBeNull();
  });
});

describe("length units", () => {
  it("1 in = 25.4 mm exactly (international inch, 1959)", () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(mmToUnit(25.4, "in")).toBe(1);
    expect(unitToMm(0.5, "in")).toBe(12.7);
    expect(unitToMm(mmToUnit(4.2, "in"), "in")).toBeCloseTo(4.2, 12);
    expect(mmToUnit(4.2, "mm")).toBe(4.2);
  });

  it("formats with matching resolution and never NaN", () => {
    expect(formatLength(5, "mm")).toBe("5.00 mm");
    expect(formatLength(5, "in")).toBe("0.1969 in");
    expect(formatLength(1.2, "mm", 1, true)).toBe("+1.2 mm");
    expect(formatLength(Number.NaN, "mm")).toBe("—");
    expect(formatLength(-0.0001, "mm")).toBe("0.00 mm");
  });
});
