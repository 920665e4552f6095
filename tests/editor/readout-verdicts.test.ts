// The live readouts judged against the kit's targets: tone and the verdict in words (not colour alone).
import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { DEFAULT_TARGETS } from "@/contracts/targets";
import { analyzeLayout } from "@/engine";
import { judgeReadoutGroups } from "@/editor/library/readout-verdicts";
import { readoutGroups } from "@/figures/readout-figures";

const a = analyzeLayout(TARNWICK_10_BASE);
const byId = (t = DEFAULT_TARGETS) => new Map(judgeReadoutGroups(readoutGroups(a, "mm"), a, t).flatMap((g) => g.readouts).map((r) => [r.id, r]));

describe("readouts judged against targets", () => {
  it("marks the lock, joint angle, clearance, Ackermann and safety factor with the verdict and the target", () => {
    const r = byId();
    // The baseline's worst lock is about 20°, short of the 30° asked.
    expect(r.get("steer-lock-worst")).toMatchObject({ tone: "bad", hint: expect.stringMatching(/^✗ misses target ≥ 30° · inner wheel/) });
    expect(r.get("joint-max")).toMatchObject({ tone: "good", hint: expect.stringMatching(/^✓ meets target ≤ 30°/) });
    // The strength readout's own "target" (the layout's design factor) gives way to the kit's target.
    expect(r.get("safety-factor")!.hint).toMatch(/^✓ meets target ≥ 2 · \d+ MPa of \d+ MPa$/);
    // Readouts no target judges are left as they were.
    expect(r.get("kpi")!.tone).toBeUndefined();
  });

  it("follows a kit's own target", () => {
    const r = byId({ ...DEFAULT_TARGETS, minLockDeg: 15 });
    expect(r.get("steer-lock-worst")).toMatchObject({ tone: "good", hint: expect.stringMatching(/^✓ meets target ≥ 15°/) });
  });
});
