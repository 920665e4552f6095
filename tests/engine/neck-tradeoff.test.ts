import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE, TARNWICK_10_CARDAN, TARNWICK_10_PRINTED } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { analyzeLayout, GeometryError, NECK_TRADEOFF_GRID, neckTradeoff, type NeckTradeoff, type NeckTradeoffPoint } from "@/engine/index";
import { neckContactAngleDeg } from "@/engine/drive/neck-contact";
import { expectGeometryError, expectRelClose } from "./near";

const withNeck = (layout: Layout, neckMm: number): Layout => ({ ...layout, drive: { ...layout.drive, neckDiameterMm: neckMm } });
const points = (t: NeckTradeoff) => t.samples.filter((s): s is NeckTradeoffPoint => s.ok);

describe("neckTradeoff — the sweep", () => {
  const t = neckTradeoff(TARNWICK_10_BASE);

  it("steps from 0.35 to 0.95 of the 8 mm mouth on a round 0.25 mm step, the 5 mm neck among them", () => {
    expect(t.samples.map((s) => s.neckDiameterMm)).toEqual([3, 3.25, 3.5, 3.75, 4, 4.25, 4.5, 4.75, 5, 5.25, 5.5, 5.75, 6, 6.25, 6.5, 6.75, 7, 7.25, 7.5]);
    expect(t.stepMm).toBe(0.25);
    expect(t.rangeMm).toEqual({ min: 3, max: 7.5 });
    expect(t.currentNeckMm).toBe(5);
    expect(t.samples[t.currentIndex]?.neckDiameterMm).toBe(5);
    expect(t.targetSafetyFactor).toBe(TARNWICK_10_BASE.strength.targetSafetyFactor);
    expect(t.grid).toEqual(NECK_TRADEOFF_GRID);
    expect(t.samples.every((s) => s.ok)).toBe(true);
  });

  it("the sample at the current neck is analyzeLayout's own figures for the layout (same grid)", () => {
    const a = analyzeLayout(TARNWICK_10_BASE, NECK_TRADEOFF_GRID);
    const s = t.samples[t.currentIndex];
    expect(s).toEqual({
      ok: true,
      neckDiameterMm: 5,
      steerLockDeg: a.steerLock.worst.innerDeg,
      steerLockOuterDeg: a.steerLock.worst.outerDeg,
      limitedBy: a.steerLock.worst.limitedBy,
      jointLimitDeg: a.drive.jointLimitDeg,
      safetyFactor: a.strength.safetyFactor,
      meetsTarget: a.strength.meetsTarget,
    });
    expect(t.minimumNeckDiameterMm).toBe(a.strength.minimumNeckDiameterMm);
    // And the other samples are the layout with that neck, analysed on the same grid.
    const thin = analyzeLayout(withNeck(TARNWICK_10_BASE, 4), NECK_TRADEOFF_GRID);
    const s4 = points(t).find((p) => p.neckDiameterMm === 4);
    expect(s4?.steerLockDeg).toBe(thin.steerLock.worst.innerDeg);
    expect(s4?.safetyFactor).toBe(thin.strength.safetyFactor);
  });

  it("safety factor falls as the neck thins, as d³ for a solid neck (τ = 16T/(πd³), Shigley torsion of round bars, REFERENCES §6.1)", () => {
    const p = points(t);
    for (let i = 1; i < p.length; i++) expect(p[i].safetyFactor).toBeGreaterThan(p[i - 1].safetyFactor);
    const at5 = p.find((s) => s.neckDiameterMm === 5)!;
    // Same torque and allowable: n = S_sy/τ ∝ d³, so n(d)/n(5) = (d/5)³.
    for (const s of p) expectRelClose(s.safetyFactor / at5.safetyFactor, (s.neckDiameterMm / 5) ** 3, 1e-12);
    for (const s of p) expect(s.meetsTarget).toBe(s.safetyFactor >= t.targetSafetyFactor);
  });

  it("for a hollow neck the safety factor goes as (D⁴ − b⁴)/D (τ = 16TD/(π(D⁴ − b⁴)), same source)", () => {
    const h = neckTradeoff(TARNWICK_10_CARDAN);
    const p = points(h);
    const b = TARNWICK_10_CARDAN.drive.boreDiameterMm!;
    const cur = p.find((s) => s.neckDiameterMm === 5)!;
    const shape = (d: number) => (d ** 4 - b ** 4) / d;
    for (const s of p) expectRelClose(s.safetyFactor / cur.safetyFactor, shape(s.neckDiameterMm) / shape(5), 1e-12);
    // The 9 mm mouth, 2 mm bore: from 0.35 × 9 = 3.15 mm (above the 2.5 mm wall minimum) to 0.95 × 9 = 8.55 mm.
    expect(h.rangeMm.min).toBeGreaterThanOrEqual(3.15);
    expect(h.rangeMm.max).toBeLessThanOrEqual(8.55);
    expect(h.samples[h.currentIndex]?.neckDiameterMm).toBe(5);
  });

  it("steer lock rises or holds as the neck thins (dβ/dd < 0, REFERENCES §8.1); neck contact binds above 5 mm", () => {
    const p = points(t);
    for (let i = 1; i < p.length; i++) expect(p[i].steerLockDeg).toBeLessThanOrEqual(p[i - 1].steerLockDeg + 1e-9);
    // Thin necks: the joint's rated angle binds and the lock holds; thick ones: the mouth does and it falls.
    expect(p[0].limitedBy).toBe("rated-angle");
    expect(p[0].steerLockDeg).toBe(p[1].steerLockDeg);
    const thick = p.find((s) => s.neckDiameterMm === 6)!;
    expect(thick.limitedBy).toBe("neck-contact");
    expect(thick.steerLockDeg).toBeLessThan(p[0].steerLockDeg - 5);
    // The joint limit at 6 mm is the §8.2 check case D 8, d 6, a 2: 21.3045°.
    expect(thick.jointLimitDeg).toBeCloseTo(neckContactAngleDeg({ mouthDiameterMm: 8, neckDiameterMm: 6, pivotDepthMm: 2 }), 12);
    expect(thick.jointLimitDeg).toBeCloseTo(21.3045, 3);
  });

  it("a slotted cup: the neck no longer sets the joint limit, so the lock holds over the whole sweep", () => {
    const s = points(neckTradeoff(TARNWICK_10_PRINTED));
    expect(s.length).toBeGreaterThan(10);
    expect(new Set(s.map((x) => x.steerLockDeg)).size).toBe(1);
  });
});

describe("neckTradeoff — gaps and options", () => {
  it("a diameter the engine refuses is a gap naming the part, never NaN", () => {
    const t = neckTradeoff(TARNWICK_10_BASE, { diametersMm: [4, 8, 9] });
    expect(t.samples.map((s) => s.neckDiameterMm)).toEqual([4, 5, 8, 9]);
    expect(t.currentIndex).toBe(1);
    expect(t.samples[2]).toMatchObject({ ok: false, part: "shaft neck" });
    expect(t.samples[3]).toMatchObject({ ok: false, part: "shaft neck" });
    expect(!t.samples[2].ok && t.samples[2].reason).toMatch(/not smaller than the cup mouth 8 mm/);
    for (const x of points(t)) for (const v of [x.steerLockDeg, x.steerLockOuterDeg, x.jointLimitDeg, x.safetyFactor]) expect(Number.isFinite(v)).toBe(true);
    expect(t.stepMm).toBeNull();
  });

  it("the current neck is always sampled, even off the step", () => {
    const t = neckTradeoff(withNeck(TARNWICK_10_BASE, 4.37));
    expect(t.samples[t.currentIndex]?.neckDiameterMm).toBe(4.37);
    const d = t.samples.map((s) => s.neckDiameterMm);
    expect([...d].sort((a, b) => a - b)).toEqual(d);
  });

  it("bad options are named errors", () => {
    expectGeometryError(() => neckTradeoff(TARNWICK_10_BASE, { samples: 2 }), "neck trade-off");
    expectGeometryError(() => neckTradeoff(TARNWICK_10_BASE, { grid: { travelSteps: 1 } }), "analysis grid");
    expectGeometryError(() => neckTradeoff(TARNWICK_10_BASE, { diametersMm: [4, Number.NaN] }), "neck trade-off");
    expect(() => neckTradeoff(TARNWICK_10_BASE, { samples: 7 })).not.toThrow(GeometryError);
    expect(neckTradeoff(TARNWICK_10_BASE, { samples: 7 }).samples.length).toBeLessThanOrEqual(8);
  });
});
