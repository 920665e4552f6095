import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GeometryError } from "@/engine/errors";
import { MATERIALS, analyzeStrength, materialById, type StrengthInput } from "@/engine/strength";
import { expectGeometryError, expectRelClose } from "../near";

const base: StrengthInput = {
  motor: { kind: "kv", kvRpmPerV: 4000, currentA: 80 },
  ratios: [76 / 22, 2.6],
  efficiency: 1,
  shaftsSharing: 2,
  neck: { diameterMm: 5, twistLengthMm: 40 },
  material: materialById("aisi-4140-qt-650"),
  targetSafetyFactor: 2,
};

describe("analyzeStrength — the whole chain", () => {
  it("composes the REFERENCES §6.3 rows: 857.700 N·mm on a 5 mm 4140 neck", () => {
    const r = analyzeStrength(base);
    expectRelClose(r.motorTorqueNm, 0.190986);
    expectRelClose(r.overallRatio, 8.9818);
    expectRelClose(r.shaftTorqueNmm, 857.7);
    // worked by hand from §6.1: τ = 16·857.7/(π·125) = 34.9458 MPa; S_sy = 655/√3 = 378.164; n = 10.8214
    expectRelClose(r.shearStressMpa, 34.9458);
    expectRelClose(r.allowableShearMpa, 378.164);
    expectRelClose(r.safetyFactor, 10.8214);
    expect(r.meetsTarget).toBe(true);
    expect(r.targetSafetyFactor).toBe(2);
    expect(r.allowableSource).toContain("(shigley-mde-9e)");
    expect(r.allowableCitations[0]).toBe("shigley-mde-9e");
    // twist: 857.7·40/(80 000·π·5⁴/32) rad (§6.1), by hand 0.006989 rad = 0.40045°
    expectRelClose(r.twistDeg ?? 0, 0.40045, 1e-4);
    // default what-if: the neck ± 0.5 and ± 1 mm
    expect(r.neckWhatIf.map((w) => w.neckDiameterMm)).toEqual([4, 4.5, 5, 5.5, 6]);
    expectRelClose(r.neckWhatIf[2].safetyFactor, r.safetyFactor, 1e-12);
  });

  it("a printed PLA neck of the same size fails a target of 2", () => {
    const r = analyzeStrength({ ...base, material: materialById("pla-fff") });
    // (35·0.8/√3)/34.9458 = 0.462596 (by hand)
    expectRelClose(r.safetyFactor, 0.462596, 1e-4);
    expect(r.meetsTarget).toBe(false);
    expect(r.allowableBasis).toBe("across-layer-derated");
    // the minimum diameter meets the target exactly
    const atMin = analyzeStrength({ ...base, material: materialById("pla-fff"), neck: { diameterMm: r.minimumNeckDiameterMm } });
    expectRelClose(atMin.safetyFactor, 2, 1e-9);
  });

  it("omits twist without a length or a shear modulus, and adds the cross pin on request", () => {
    expect(analyzeStrength({ ...base, neck: { diameterMm: 5 } }).twistDeg).toBeUndefined();
    expect(analyzeStrength({ ...base, material: materialById("pa12-cf-fff-annealed") }).twistDeg).toBeUndefined();
    const r = analyzeStrength({ ...base, crossPin: { contactRadiusMm: 4, pinDiameterMm: 2 } });
    // 857.7/(2·4) = 107.2125 N; /π = 34.1268 MPa (by hand from §6.1)
    expectRelClose(r.crossPin?.forcePerEndN ?? 0, 107.2125);
    expectRelClose(r.crossPin?.shearStressMpa ?? 0, 34.1268);
    expectRelClose(r.crossPin?.safetyFactor ?? 0, 378.164 / 34.1268);
  });

  it("a thinner neck lowers the safety factor", () => {
    const r = analyzeStrength({ ...base, neckWhatIfMm: [3, 3.5, 4, 4.5] });
    const factors = r.neckWhatIf.map((w) => w.safetyFactor);
    expect(factors).toEqual([...factors].sort((a, b) => a - b));
  });
});

describe("analyzeStrength — properties (fast-check)", () => {
  const metalOrPrinted = fc.constantFrom(...MATERIALS);
  const input = fc.record({
    motor: fc.oneof(
      fc.record({ kind: fc.constant("torque" as const), torqueNm: fc.double({ min: 0.01, max: 5, noNaN: true }) }),
      fc.record({
        kind: fc.constant("kv" as const),
        kvRpmPerV: fc.double({ min: 500, max: 10_000, noNaN: true }),
        currentA: fc.double({ min: 5, max: 200, noNaN: true }),
      }),
    ),
    ratios: fc.array(fc.double({ min: 0.2, max: 10, noNaN: true }), { maxLength: 4 }),
    efficiency: fc.double({ min: 0.05, max: 1, noNaN: true }),
    shaftsSharing: fc.integer({ min: 1, max: 4 }),
    neck: fc.record({ diameterMm: fc.double({ min: 1, max: 20, noNaN: true }) }),
    material: metalOrPrinted,
    targetSafetyFactor: fc.double({ min: 0.5, max: 5, noNaN: true }),
  });

  it("the safety factor of a solid neck scales with d³", () => {
    fc.assert(
      fc.property(input, fc.double({ min: 0.2, max: 5, noNaN: true }), (p, k) => {
        const r1 = analyzeStrength(p);
        const r2 = analyzeStrength({ ...p, neck: { diameterMm: p.neck.diameterMm * k } });
        return Math.abs(r2.safetyFactor / r1.safetyFactor / k ** 3 - 1) < 1e-9;
      }),
    );
  });

  it("no finite valid input gives NaN or Infinity anywhere in the result", () => {
    fc.assert(
      fc.property(input, (p) => {
        const r = analyzeStrength(p);
        const numbers = JSON.stringify(r, (_, v) => (typeof v === "number" && !Number.isFinite(v) ? "BAD" : v));
        return !numbers.includes("BAD") && r.safetyFactor > 0;
      }),
    );
  });

  it("random bad numbers give a GeometryError, never NaN", () => {
    fc.assert(
      fc.property(input, fc.constantFrom("efficiency", "shaftsSharing", "targetSafetyFactor", "diameter"), fc.double(), (p, field, bad) => {
        const broken: StrengthInput =
          field === "diameter" ? { ...p, neck: { diameterMm: bad } } : { ...p, [field]: bad };
        try {
          const r = analyzeStrength(broken);
          return Number.isFinite(r.safetyFactor) && Number.isFinite(r.shearStressMpa);
        } catch (error) {
          return error instanceof GeometryError;
        }
      }),
    );
  });

  it("missing parts are named", () => {
    expectGeometryError(() => analyzeStrength({ ...base, neck: undefined as never }), "shaft neck");
    expectGeometryError(() => analyzeStrength({ ...base, neckWhatIfMm: Array.from({ length: 65 }, () => 5) }), "shaft neck");
    expectGeometryError(() => analyzeStrength({ ...base, neck: { diameterMm: 5, boreMm: 6 } }), "shaft neck");
  });
});
