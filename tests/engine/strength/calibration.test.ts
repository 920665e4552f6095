import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { calibrateAllowable, type CalibrationRun } from "@/engine/strength/calibration";
import { expectRelClose } from "../near";

// n = S_sy/τ is linear in S_sy (Shigley 9th ed. §5-5 [F, via REFERENCES §6.1]), so a factor k on the allowable
// multiplies every predicted safety factor by k. The midway-on-a-log-scale choice is our own (module comment).

const run = (safetyFactor: number, outcome: CalibrationRun["outcome"]): CalibrationRun => ({ safetyFactor, outcome });

describe("calibrateAllowable", () => {
  it("held at 2.0 and 1.6, broke at 0.9 and 1.0: k = 1/√(1.6 · 1.0) = 0.790569, range [0.625, 1)", () => {
    const c = calibrateAllowable([run(2, "held"), run(1.6, "held"), run(0.9, "broke"), run(1, "broke")]);
    expect(c.status).toBe("separated");
    expect([c.lowestHeld, c.highestBroke, c.held, c.broke, c.runs]).toEqual([1.6, 1, 2, 2, 4]);
    expectRelClose(c.factor!, 0.790569, 1e-6);
    expectRelClose(c.factorRange!.min, 0.625, 1e-12);
    expectRelClose(c.factorRange!.max, 1, 1e-12);
    // After scaling, the two bounding runs sit at 1.2649 and 0.7906: equal ratios either side of 1.
    expectRelClose(1.6 * c.factor!, 1 / (1 * c.factor!), 1e-12);
  });

  it("a material stronger than its figure: broke at 3.1, held at 4 → k = 1/√12.4 = 0.283981", () => {
    const c = calibrateAllowable([run(4, "held"), run(3.1, "broke"), run(5.2, "held")]);
    expectRelClose(c.factor!, 1 / Math.sqrt(12.4), 1e-12);
  });

  it("a broken run predicted above a held one: overlap, no factor", () => {
    const c = calibrateAllowable([run(1.5, "held"), run(1.7, "broke"), run(2.5, "held")]);
    expect(c).toMatchObject({ status: "overlap", lowestHeld: 1.5, highestBroke: 1.7, factor: null, factorRange: null });
  });

  it("equal factors held and broke: overlap (no k makes one ≥ 1 and the other < 1)", () => {
    expect(calibrateAllowable([run(1.2, "held"), run(1.2, "broke")]).status).toBe("overlap");
  });

  it("only held runs, or none: one-sided, the other bound missing", () => {
    expect(calibrateAllowable([run(1.4, "held"), run(2, "held")])).toMatchObject({ status: "one-sided", lowestHeld: 1.4, highestBroke: null, factor: null });
    expect(calibrateAllowable([])).toMatchObject({ status: "one-sided", runs: 0, lowestHeld: null, highestBroke: null });
  });

  it("worn runs are counted but bound nothing", () => {
    const c = calibrateAllowable([run(0.5, "worn"), run(9, "worn"), run(2, "held"), run(1.2, "broke")]);
    expect([c.worn, c.lowestHeld, c.highestBroke]).toEqual([2, 2, 1.2]);
    expect(c.status).toBe("separated");
  });

  it("runs without a usable prediction are skipped, never NaN", () => {
    const c = calibrateAllowable([run(Number.NaN, "held"), run(0, "broke"), run(-1, "broke"), run(Infinity, "held"), run(2, "held"), run(1, "broke")]);
    expect(c.runs).toBe(2);
    expect(Number.isFinite(c.factor!)).toBe(true);
  });

  it("property: when separated, k makes every held run ≥ 1 and every broken run < 1", () => {
    const sf = fc.double({ min: 0.05, max: 50, noNaN: true });
    fc.assert(
      fc.property(fc.array(fc.tuple(sf, fc.constantFrom("held", "worn", "broke") as fc.Arbitrary<CalibrationRun["outcome"]>), { maxLength: 30 }), (pairs) => {
        const c = calibrateAllowable(pairs.map(([s, o]) => run(s, o)));
        if (c.status !== "separated") return;
        for (const [s, o] of pairs) {
          if (o === "held") expect(s * c.factor!).toBeGreaterThanOrEqual(1 - 1e-12);
          if (o === "broke") expect(s * c.factor!).toBeLessThan(1);
        }
        expect(c.factor!).toBeGreaterThanOrEqual(c.factorRange!.min);
        expect(c.factor!).toBeLessThan(c.factorRange!.max);
      }),
    );
  });
});
