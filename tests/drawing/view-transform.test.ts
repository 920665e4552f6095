import { describe, expect, it } from "vitest";
import { boxOf, fitBox, gridSpacingMm, planeToScreen, scaleBarMm, screenToPlane, zoomAt } from "@/drawing/view-transform";

describe("view transform", () => {
  const t = { scale: 4, ox: 100, oy: 300 };

  it("maps plane (v up) to screen (y down) and back", () => {
    expect(planeToScreen(t, [10, 20])).toEqual([140, 220]);
    expect(screenToPlane(t, [140, 220])).toEqual([10, 20]);
  });

  it("zooms about the pointer: the point under it stays put", () => {
    const z = zoomAt(t, [180, 120], 1.5);
    expect(z.scale).toBe(6);
    const before = screenToPlane(t, [180, 120]);
    const after = screenToPlane(z, [180, 120]);
    expect(after[0]).toBeCloseTo(before[0], 12);
    expect(after[1]).toBeCloseTo(before[1], 12);
  });

  it("fits a box centred with its margin", () => {
    const f = fitBox({ minU: 0, maxU: 100, minV: 0, maxV: 50 }, 648, 400, 24);
    expect(f.scale).toBe(6); // min(600/100, 352/50)
    expect(planeToScreen(f, [50, 25])).toEqual([324, 200]);
    expect(boxOf([[1, 2], [-3, 5], [Number.NaN, 9]])).toEqual({ minU: -3, maxU: 1, minV: 2, maxV: 5 });
  });

  it("draws the snap grid when it is big enough to see, else multiples of it", () => {
    expect(gridSpacingMm(20, 0.5)).toBe(0.5);
    expect(gridSpacingMm(4, 0.5)).toBe(2.5);
    expect(gridSpacingMm(1, 0.5)).toBe(10);
    expect(scaleBarMm(4)).toBe(20);
    expect(scaleBarMm(0.5)).toBe(100);
  });
});
