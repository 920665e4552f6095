// A layout's own material may name its shear allowable rule (a shelf material carries one): the analysis
// applies it. Distortion energy S_sy = S_y/√3 and maximum shear (Tresca) S_sy = S_y/2, Shigley's Mechanical
// Engineering Design 9th ed. §5-5 (eq. 5-21 and the Tresca comparison beside it).
import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { analyzeLayout } from "@/engine";
import { expectRelClose } from "../near";

const own = (shearRule?: "distortion-energy" | "tresca"): Layout => ({
  ...TARNWICK_10_BASE,
  strength: { ...TARNWICK_10_BASE.strength, material: { kind: "custom", name: "Test bar", yieldMpa: 800, source: "invented for the test", printed: false, derate: 1, ...(shearRule ? { shearRule } : {}) } },
});

describe("the shear rule of a layout's own material", () => {
  it("absent means distortion energy: S_y/√3", () => {
    const s = analyzeLayout(own()).strength;
    expect(s.allowableCriterion).toBe("distortion-energy");
    expectRelClose(s.allowableShearMpa, 800 / Math.sqrt(3));
  });

  it("tresca halves the yield, so the safety factor falls by √3/2 for the same neck and torque", () => {
    const de = analyzeLayout(own("distortion-energy")).strength;
    const tr = analyzeLayout(own("tresca")).strength;
    expect(tr.allowableCriterion).toBe("tresca");
    expectRelClose(tr.allowableShearMpa, 400);
    expectRelClose(tr.safetyFactor / de.safetyFactor, Math.sqrt(3) / 2);
    expect(tr.allowableSource).toContain("Tresca");
  });
});
