// The design search's pure parts: the question's checks, judging against the aims, the sample, the front.
import { describe, expect, it } from "vitest";
import { aimShortfalls, applyFigures, changesOf, searchNote, searchQuestionSchema, violationOf, type SearchCandidate } from "@/contracts/design-search";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { DEFAULT_TARGETS } from "@/contracts/targets";
import { nonDominated, samplePoint, searchSpace, valuesAt } from "@/server/search/search-space";

const AIMS = { ...DEFAULT_TARGETS, minLockDeg: 26, minSafetyFactor: 10 };
const cand = (lockDeg: number, safetyFactor: number): SearchCandidate => ({
  values: {},
  readouts: { lockDeg, safetyFactor, maxJointAngleDeg: 20, ackermannPct: 50, neckClearanceMm: 0.3 },
  shortfalls: {},
  violation: 0,
  change: 0,
});

describe("the design search question", () => {
  it("names the field and reason of a bad move", () => {
    const r = searchQuestionSchema.safeParse({ moves: [{ key: "neckDiameterMm", min: 5, max: 4 }, { key: "material", choices: ["cheese"] }], aims: AIMS, prefer: "most-lock" });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(["moves.0.min", "moves.1.choices.0"]);
  });
});

describe("judging a layout against the aims", () => {
  it("gives each missed aim's shortfall in its unit and weighs them by scale", () => {
    const s = aimShortfalls({ lockDeg: 24, maxJointAngleDeg: 31, ackermannPct: 50, safetyFactor: 9.5, neckClearanceMm: 0.3 }, AIMS);
    expect(s.minLockDeg).toBeCloseTo(2, 9);
    expect(s.maxJointAngleDeg).toBeCloseTo(1, 9);
    expect(s.minSafetyFactor).toBeCloseTo(0.5, 9);
    expect(s.minNeckClearanceMm).toBeUndefined();
    // 2° + 1° + 0.5 / 0.25
    expect(violationOf(s)).toBeCloseTo(5, 9);
    // A slotted cup has no clearance to judge; Ackermann with too little steer misses.
    expect(aimShortfalls({ lockDeg: 30, maxJointAngleDeg: 20, ackermannPct: null, safetyFactor: 12, neckClearanceMm: null }, AIMS)).toEqual({ ackermannMinPct: 100, ackermannMaxPct: 100 });
  });

  it("describes the change and writes the note that names the search", () => {
    const changes = changesOf({ neckDiameterMm: 5, jointType: "dogbone" }, { neckDiameterMm: 4.71, jointType: "cvd" });
    expect(changes).toEqual([
      { key: "neckDiameterMm", label: "Neck diameter", from: "5 mm", to: "4.71 mm" },
      { key: "jointType", label: "Joint kind", from: "dogbone", to: "cvd" },
    ]);
    expect(searchNote("1a2b3c4d-0000-4000-8000-000000000000", 2, changes)).toBe("From design search 1a2b3c4d, layout 2 of its best: Neck diameter 5 mm → 4.71 mm; Joint kind dogbone → cvd");
    expect(applyFigures(TARNWICK_10_BASE, { neckDiameterMm: 4.71, boreDiameterMm: 0 }).drive).toEqual({ ...TARNWICK_10_BASE.drive, neckDiameterMm: 4.71 });
  });
});

describe("the sample and the front", () => {
  it("fills the space: every point inside its range, and the first 64 spread over both halves of each figure", () => {
    const space = searchSpace(TARNWICK_10_BASE, searchQuestionSchema.parse({ moves: [{ key: "neckDiameterMm", min: 3, max: 6 }, { key: "pivotDepthMm", min: 1, max: 3 }, { key: "jointType", choices: ["dogbone", "cvd"] }], aims: AIMS, prefer: "most-lock" }), "seed");
    const points = Array.from({ length: 64 }, (_, i) => valuesAt(space, samplePoint(space, i)));
    for (const p of points) {
      expect(p.neckDiameterMm).toBeGreaterThanOrEqual(3);
      expect(p.neckDiameterMm).toBeLessThanOrEqual(6);
      expect(["dogbone", "cvd"]).toContain(p.jointType);
    }
    const low = points.filter((p) => Number(p.neckDiameterMm) < 4.5).length;
    expect(low).toBeGreaterThanOrEqual(28);
    expect(low).toBeLessThanOrEqual(36);
    expect(points.filter((p) => p.jointType === "cvd").length).toBeGreaterThanOrEqual(28);
  });

  it("keeps only the layouts no other beats on both lock and safety factor, by lock", () => {
    const front = nonDominated([cand(20, 15), cand(25, 12), cand(24, 11), cand(30, 8), cand(26, 12)]);
    expect(front.map((c) => [c.readouts.lockDeg, c.readouts.safetyFactor])).toEqual([[20, 15], [26, 12], [30, 8]]);
  });
});
