import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  minimumNeckDiameterMm,
  polarMomentMm4,
  torsionalShearStressMpa,
  twistAngleDeg,
  twistAngleRad,
} from "@/engine/strength/torsion";
import { expectGeometryError, expectRelClose } from "../near";

describe("torsional shear τ = 16T/(πd³), hollow 16TD/(π(D⁴−d⁴)) — amesweb torsion page [F, via REFERENCES §6.1]; check cases §6.3", () => {
  it.each([
    { T: 1000, D: 8, b: 0, tau: 9.9472, J: 402.1239 },
    { T: 2000, D: 5, b: 0, tau: 81.4873, J: 61.3592 },
    { T: 500, D: 4, b: 0, tau: 39.7887, J: 25.1327 },
    { T: 1000, D: 8, b: 4, tau: 10.6103, J: 376.9911 },
  ])("T $T N·mm, D $D, bore $b → τ $tau MPa, J $J mm⁴", ({ T, D, b, tau, J }) => {
    expectRelClose(torsionalShearStressMpa(T, { diameterMm: D, boreMm: b }), tau);
    expectRelClose(polarMomentMm4({ diameterMm: D, boreMm: b }), J);
  });

  it("hollow D 6, bore 3, 800 N·mm → 20.1203 MPa; hollow/solid = 1/(1 − 0.5⁴) (REFERENCES §6.3)", () => {
    expectRelClose(torsionalShearStressMpa(800, { diameterMm: 6, boreMm: 3 }), 20.1203);
    const ratio = torsionalShearStressMpa(1000, { diameterMm: 8, boreMm: 4 }) / torsionalShearStressMpa(1000, { diameterMm: 8 });
    expectRelClose(ratio, 1 / (1 - 0.5 ** 4), 1e-12);
  });

  it("the sign of the torque does not change the stress magnitude", () => {
    expect(torsionalShearStressMpa(-500, { diameterMm: 4 })).toBe(torsionalShearStressMpa(500, { diameterMm: 4 }));
  });
});

describe("angle of twist θ = TL/(GJ) — amesweb torsion page [F, via REFERENCES §6.1]; check cases §6.3", () => {
  it("steel: 1566.619 N·mm, 40 mm, d 5, G 80 GPa → 0.012766 rad = 0.7314°", () => {
    expectRelClose(twistAngleRad(1566.619, 40, 80_000, { diameterMm: 5 }), 0.012766);
    expect(Math.abs(twistAngleDeg(1566.619, 40, 80_000, { diameterMm: 5 }) - 0.7314)).toBeLessThan(1e-3);
    expect(Math.abs(twistAngleDeg(1562.6, 40, 80_000, { diameterMm: 5 }) - 0.7296)).toBeLessThan(1e-3);
  });

  it("printed polymer G 1000 MPa (rough figure, common practice): 1000 N·mm, 30 mm, d 8 → 4.2745°", () => {
    expectRelClose(twistAngleRad(1000, 30, 1000, { diameterMm: 8 }), 0.074604);
    expect(Math.abs(twistAngleDeg(1000, 30, 1000, { diameterMm: 8 }) - 4.2745)).toBeLessThan(1e-3);
  });

  it("aluminium G 26.9 GPa (from memory, REFERENCES §7.2 [M]): 500 N·mm, 40 mm, d 4 → 1.6950°", () => {
    expectRelClose(twistAngleRad(500, 40, 26_900, { diameterMm: 4 }), 0.029583);
    expect(Math.abs(twistAngleDeg(500, 40, 26_900, { diameterMm: 4 }) - 1.695)).toBeLessThan(1e-3);
  });
});

describe("worked cases of our own from the textbook formulas", () => {
  it("Shigley's Mechanical Engineering Design ch. 3 / Roark's torsion chapter, solid shaft τ = 16T/(πd³) [M], worked by hand", () => {
    // Chosen so the hand arithmetic is exact: T = 25π N·mm on d = 2 mm → τ = 16·25π/(8π) = 50 MPa;
    // J = π·2⁴/32 = π/2 mm⁴; twist over 10 mm at G = 80 000 MPa: 25π·10/(80 000·π/2) = 0.00625 rad.
    expectRelClose(torsionalShearStressMpa(25 * Math.PI, { diameterMm: 2 }), 50, 1e-12);
    expectRelClose(polarMomentMm4({ diameterMm: 2 }), Math.PI / 2, 1e-12);
    expectRelClose(twistAngleRad(25 * Math.PI, 10, 80_000, { diameterMm: 2 }), 0.00625, 1e-12);
  });

  it("Shigley / Roark hollow shaft τ = 16TD/(π(D⁴ − d⁴)) [M], worked by hand: D 4, bore 2, T = 15π N·mm", () => {
    // D⁴ − d⁴ = 256 − 16 = 240; τ = 16·15π·4/(240π) = 4 MPa exactly.
    expectRelClose(torsionalShearStressMpa(15 * Math.PI, { diameterMm: 4, boreMm: 2 }), 4, 1e-12);
  });

  it("minimum solid neck: d = (16Tn/(πS_sy))^(1/3), worked by hand: k = 125 → d = 5 mm", () => {
    // 16·T·n/(π·S) = 125 with S = 100 MPa, n = 2 → T = 125π·100/32 N·mm
    const T = (125 * Math.PI * 100) / 32;
    expectRelClose(minimumNeckDiameterMm({ shaftTorqueNmm: T, allowableShearMpa: 100, targetSafetyFactor: 2 }), 5, 1e-12);
  });
});

describe("minimum neck diameter (hollow by root-finding)", () => {
  it("the hollow minimum puts τ exactly at S_sy/n, and agrees with a bisection", () => {
    const p = { shaftTorqueNmm: 1469.422, allowableShearMpa: 378.16, targetSafetyFactor: 3, boreMm: 2.5 };
    const D = minimumNeckDiameterMm(p);
    expectRelClose(torsionalShearStressMpa(p.shaftTorqueNmm, { diameterMm: D, boreMm: p.boreMm }), 378.16 / 3, 1e-9);
    let lo = p.boreMm + 1e-9;
    let hi = 100;
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (torsionalShearStressMpa(p.shaftTorqueNmm, { diameterMm: mid, boreMm: p.boreMm }) > 378.16 / 3) lo = mid;
      else hi = mid;
    }
    expectRelClose(D, (lo + hi) / 2, 1e-9);
    expect(D).toBeGreaterThan(minimumNeckDiameterMm({ ...p, boreMm: 0 }));
  });

  it("holds over random torques, allowables and bores (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.double({ min: 5, max: 2000, noNaN: true }),
        fc.double({ min: 1, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        (T, S, n, b) => {
          const D = minimumNeckDiameterMm({ shaftTorqueNmm: T, allowableShearMpa: S, targetSafetyFactor: n, boreMm: b });
          const tau = torsionalShearStressMpa(T, { diameterMm: D, boreMm: b });
          return D > b && Math.abs(tau / (S / n) - 1) < 1e-9;
        },
      ),
    );
  });
});

describe("torsion — invalid input is a named error", () => {
  it("bore not smaller than the neck, bad sizes, bad moduli", () => {
    expectGeometryError(() => torsionalShearStressMpa(100, { diameterMm: 4, boreMm: 4 }), "shaft neck");
    expectGeometryError(() => torsionalShearStressMpa(100, { diameterMm: 0 }), "shaft neck");
    expectGeometryError(() => torsionalShearStressMpa(Number.NaN, { diameterMm: 4 }), "drive shaft");
    expectGeometryError(() => twistAngleRad(100, 10, 0, { diameterMm: 4 }), "material");
    expectGeometryError(() => torsionalShearStressMpa(1, { diameterMm: 1e-200 }), "shaft neck");
    expectGeometryError(() => minimumNeckDiameterMm({ shaftTorqueNmm: 100, allowableShearMpa: -1, targetSafetyFactor: 2 }), "material");
  });

  it("any finite or non-finite numbers either answer finitely or throw GeometryError (fast-check)", () => {
    fc.assert(
      fc.property(fc.double(), fc.double(), fc.double(), (T, D, b) => {
        try {
          return Number.isFinite(torsionalShearStressMpa(T, { diameterMm: D, boreMm: b }));
        } catch (error) {
          return error instanceof Error && error.name === "GeometryError";
        }
      }),
    );
  });
});
