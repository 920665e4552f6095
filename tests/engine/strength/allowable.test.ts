import { isCitationKey } from "@/engine/methods/citations";
import { describe, expect, it } from "vitest";
import { allowableShear, shearYieldFromTensileMpa } from "@/engine/strength/allowable";
import { MATERIALS, materialById, type PrintedFigure } from "@/engine/strength/materials";
import { expectGeometryError, expectRelClose } from "../near";

describe("shear yield S_sy = S_y/√3 — Shigley 9th ed. §5-5 eq. (5-21) [F, via REFERENCES §6.1]; check cases §6.3", () => {
  it("S_y 655 → S_y/√3 = 378.16 MPa, Tresca 0.5·S_y = 327.50 MPa", () => {
    expectRelClose(shearYieldFromTensileMpa(655), 378.16);
    expectRelClose(shearYieldFromTensileMpa(655, "tresca"), 327.5);
  });

  // The sheet's rows use the rounded 0.577 factor; our exact 1/√3 sits 0.0613 % above them (DESIGN.md).
  it.each([
    [655, 377.93],
    [834, 481.22],
    [505, 291.38],
    [503, 290.23],
    [417.1, 240.67],
  ])("S_y %f → %f MPa at 0.577, and 1/√3 ÷ 0.577 above it", (sy, rounded) => {
    expectRelClose(shearYieldFromTensileMpa(sy), rounded * (1 / Math.sqrt(3) / 0.577));
  });

  it("distortion energy sits about 15 % above Tresca (Shigley 9th ed. §5-5 [F, via REFERENCES §6.1])", () => {
    expectRelClose(shearYieldFromTensileMpa(500) / shearYieldFromTensileMpa(500, "tresca"), 2 / Math.sqrt(3), 1e-12);
  });
});

describe("allowable shear of the table's materials", () => {
  it("a metal uses its yield strength and names the source", () => {
    const a = allowableShear(materialById("aisi-4140-qt-650"));
    expectRelClose(a.allowableShearMpa, 378.16);
    expect(a.basis).toBe("tensile-yield");
    expect(a.derateFactor).toBe(1);
    expect(a.source).toContain("(shigley-mde-9e)");
    expect(a.source).toContain("efunda");
    expect(a.citations).toEqual(["shigley-mde-9e", "efunda-aisi-4140"]);
  });

  it("a printed material uses its across-layer strength × derate, then the criterion (REFERENCES §6.3 caution [C])", () => {
    const pla = materialById("pla-fff") as PrintedFigure;
    const a = allowableShear(pla);
    expect(a.basis).toBe("across-layer-derated");
    // 35 MPa across layers (additive.tools low end, REFERENCES §7.1 [F]) × 0.8 derate / √3
    expectRelClose(a.allowableShearMpa, (35 * 0.8) / Math.sqrt(3));
    expect(a.source).toContain("additive.tools");
    expect(a.source).toContain("derate");
  });

  it("PA12-CF printed upright is far weaker than in-plane: 8.78 vs 27.71 MPa (Babiș et al. 2025 [F, via REFERENCES §7.1])", () => {
    const m = materialById("pa12-cf-fff-annealed") as PrintedFigure;
    expect(m.acrossLayerStrengthMpa).toBe(8.78);
    expectRelClose(m.acrossLayerStrengthMpa / (m.inPlaneStrengthMpa ?? 0), 0.32, 0.01);
  });

  it("every table entry has a source, a positive strength and a valid derate", () => {
    expect(new Set(MATERIALS.map((m) => m.id)).size).toBe(MATERIALS.length);
    for (const m of MATERIALS) {
      expect(m.strengthSource.note.length).toBeGreaterThan(10);
      expect(m.strengthSource.cites.length).toBeGreaterThan(0);
      for (const key of m.strengthSource.cites) expect(isCitationKey(key), key).toBe(true);
      const a = allowableShear(m);
      expect(a.allowableShearMpa).toBeGreaterThan(0);
      if (m.kind === "printed") expect(m.derateFactor).toBeGreaterThan(0);
      if (m.shearModulusMpa !== undefined) expect(m.shearModulusSource).toBeDefined();
    }
  });

  it("invalid figures are named errors", () => {
    expectGeometryError(() => materialById("unobtainium"), "material");
    const pla = materialById("pla-fff") as PrintedFigure;
    expectGeometryError(() => allowableShear({ ...pla, derateFactor: 1.5 }), "material");
    expectGeometryError(() => allowableShear({ ...pla, acrossLayerStrengthMpa: 0 }), "material");
    expectGeometryError(() => shearYieldFromTensileMpa(Number.NaN), "material");
  });
});
