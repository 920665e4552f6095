// The comparison's rows from real analyses: every output and input of two layouts side by side, the
// second marked against the first — better or worse against each kit's targets, or changed, or the same.
import { describe, expect, it } from "vitest";
import type { ComparedItem } from "@/contracts/compare";
import { TARNWICK_10_BASE, TARNWICK_10_CVD, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { DEFAULT_TARGETS, type Targets } from "@/contracts/targets";
import { analyzeLayout } from "@/engine";
import { inputRows, outputRows } from "@/editor/compare/compare-rows";

const item = (layout: Layout, targets: Targets = DEFAULT_TARGETS): ComparedItem => ({
  kitId: "k", kitName: "k", scale: "1:10", revision: 1, isHead: true, headRevision: 1, layout, analysis: analyzeLayout(layout), problem: null, targets,
});
const row = (rows: ReturnType<typeof outputRows>, id: string) => rows.find((r) => r.id === id)!;

describe("compare rows", () => {
  it("marks the thinner neck: more lock (better), clearance now meeting its target, less strength (worse)", () => {
    const rows = outputRows([item(TARNWICK_10_BASE), item(TARNWICK_10_THIN_NECK)], "mm");
    const base = analyzeLayout(TARNWICK_10_BASE);
    const thin = analyzeLayout(TARNWICK_10_THIN_NECK);
    expect(thin.steerLock.worst.innerDeg).toBeGreaterThan(base.steerLock.worst.innerDeg);
    expect(row(rows, "out-lock").cells.map((c) => c.change)).toEqual([null, "better"]);
    expect(row(rows, "out-lock").cells[1]!.delta).toBe(`+${(thin.steerLock.worst.innerDeg - base.steerLock.worst.innerDeg).toFixed(1)}°`);
    expect(row(rows, "out-clearance").cells[1]).toMatchObject({ change: "better", crossed: "now-meets", verdict: "meets" });
    expect(row(rows, "out-safety").cells[1]).toMatchObject({ change: "worse", crossed: null, verdict: "meets", text: thin.strength.safetyFactor.toFixed(2) });
    expect(row(rows, "out-caster")).toMatchObject({ differs: false });
    expect(row(rows, "out-lock-by").cells[1]).toMatchObject({ change: "changed", text: "joint's rated angle" });
  });

  it("judges each kit by its own targets", () => {
    // The CVD's joint angle (40°) misses the workspace's 30° but meets a kit target of 42°.
    const own = item(TARNWICK_10_CVD, { ...DEFAULT_TARGETS, maxJointAngleDeg: 42 });
    const rows = outputRows([item(TARNWICK_10_CVD), own], "mm");
    expect(row(rows, "out-joint-max").cells.map((c) => c.verdict)).toEqual(["misses", "meets"]);
    expect(row(rows, "out-joint-max").cells[1]).toMatchObject({ change: "better", crossed: "now-meets" });
  });

  it("lists every input, marking the ones that differ, lengths in the user's unit", () => {
    const rows = inputRows([item(TARNWICK_10_BASE), item(TARNWICK_10_THIN_NECK)], "in");
    const neck = rows.find((r) => r.id === "in-drive.neckDiameterMm")!;
    expect(neck.cells.map((c) => c.text)).toEqual(["0.1969 in", "0.1575 in"]);
    expect(neck.cells[1]).toMatchObject({ change: "changed", delta: "-0.0394 in" });
    expect(rows.filter((r) => r.differs).map((r) => r.id)).toEqual(["in-drive.neckDiameterMm"]);
    // Variant fields no layout uses are left out (the motor given by torque).
    expect(rows.some((r) => r.id === "in-strength.motor.torqueNm")).toBe(false);
  });
});
