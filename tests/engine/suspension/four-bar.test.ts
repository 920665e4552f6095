import { describe, expect, it } from "vitest";
import { degToRad, radToDeg } from "@/engine/math/angle";
import { fourBarCoefficients, fourBarConstants, fourBarIsGrashof, fourBarPositionRads, type FourBarLinks } from "@/engine/suspension/four-bar";
import { DEG_TOL, expectNear, expectRel } from "../near";

const links = (a: number, b: number, c: number, d: number): FourBarLinks => ({ inputMm: a, couplerMm: b, outputMm: c, groundMm: d });

// Check cases of REFERENCES §3.2: Norton, Design of Machinery 5th ed. ch. 4 closed form [M, via REFERENCES §3.1],
// values computed for the sheet and confirmed there by a circle-intersection solver.
const CASES: [number, number, number, number, number, number, number, number, number][] = [
  [40, 120, 80, 100, 40, 20.2979, 57.3249, -60.978, -98.005],
  [40, 120, 80, 100, 0, 36.3361, 62.7204, -36.3361, -62.7204],
  [40, 120, 80, 100, 180, 34.7719, 121.1886, -34.7719, -121.1886],
  [30, 70, 60, 80, 60, 28.9671, 93.5901, -72.5407, -137.1637],
  [25, 60, 45, 70, 120, 15.4514, 123.243, -44.8607, -152.6523],
];

describe("four-bar closed form (REFERENCES §3.2)", () => {
  it.each(CASES)("a,b,c,d = %d,%d,%d,%d at θ2 = %d°", (a, b, c, d, t2, t3o, t4o, t3x, t4x) => {
    const open = fourBarPositionRads(links(a, b, c, d), degToRad(t2), "open");
    const crossed = fourBarPositionRads(links(a, b, c, d), degToRad(t2), "crossed");
    expect(open && crossed).toBeTruthy();
    expectNear(radToDeg(open!.couplerRad), t3o, DEG_TOL, "θ3 open");
    expectNear(radToDeg(open!.outputRad), t4o, DEG_TOL, "θ4 open");
    expectNear(radToDeg(crossed!.couplerRad), t3x, DEG_TOL, "θ3 crossed");
    expectNear(radToDeg(crossed!.outputRad), t4x, DEG_TOL, "θ4 crossed");
  });

  it("intermediate constants of the first row (REFERENCES §3.2, Norton's K1…K5, A…F)", () => {
    const k = fourBarConstants(links(40, 120, 80, 100));
    expectRel(k.k1, 2.5);
    expectRel(k.k2, 1.25);
    expectRel(k.k3, 0.5625);
    expectRel(k.k4, 0.833333);
    expectRel(k.k5, -2.041667);
    const co = fourBarCoefficients(k, degToRad(40));
    expectRel(co.a, -2.129011);
    expectRel(co.b, -1.285575);
    expectRel(co.c, 1.3389);
    expectRel(co.d, -3.137252);
    expectRel(co.f, 0.330659);
    expectRel(co.outputDiscriminant, 13.054836);
    expectRel(co.couplerDiscriminant, 5.802149);
  });

  it("non-Grashof 40/50/30/100 closes at 49° but not at 50° (REFERENCES §3.2 cannot-close)", () => {
    const l = links(40, 50, 30, 100);
    expect(fourBarIsGrashof(l)).toBe(false);
    const k = fourBarConstants(l);
    expectRel(fourBarCoefficients(k, degToRad(49)).outputDiscriminant, 0.200336, 1e-4, "B² − 4AC at 49°");
    expectRel(fourBarCoefficients(k, degToRad(50)).outputDiscriminant, -0.242725, 1e-4, "B² − 4AC at 50°");
    expectRel(fourBarCoefficients(k, degToRad(60)).outputDiscriminant, -6, 1e-4, "at 60°");
    expectRel(fourBarCoefficients(k, degToRad(180)).outputDiscriminant, -176, 1e-4, "at 180°");
    expect(fourBarPositionRads(l, degToRad(49), "open")).not.toBeNull();
    expect(fourBarPositionRads(l, degToRad(50), "open")).toBeNull();
    const at0 = fourBarPositionRads(l, 0, "open")!;
    expectNear(Math.abs(radToDeg(at0.couplerRad)), 29.9264, DEG_TOL, "θ3 at 0°");
    expectNear(Math.abs(radToDeg(at0.outputRad)), 123.749, DEG_TOL, "θ4 at 0°");
  });

  it("40/20/30/100 never assembles (a + b + c < d; REFERENCES §3.2)", () => {
    const l = links(40, 20, 30, 100);
    expectRel(fourBarCoefficients(fourBarConstants(l), 0).outputDiscriminant, -2.673611);
    for (let t = -180; t <= 180; t += 15) expect(fourBarPositionRads(l, degToRad(t), "open")).toBeNull();
  });

  // Own worked case, constructed by hand from Norton's ch. 4 formulation [M]: a Grashof crank-rocker
  // 20/70/60/80; expected angles computed for this test by intersecting the coupler and rocker circles
  // (python, independent of the closed form).
  it("own case: crank-rocker 20/70/60/80 at 30° and 135° (Norton ch. 4 [M], circle-intersection values)", () => {
    const l = links(20, 70, 60, 80);
    expect(fourBarIsGrashof(l)).toBe(true);
    const a = fourBarPositionRads(l, degToRad(30), "open")!;
    expectNear(radToDeg(a.couplerRad), 44.0892, DEG_TOL, "θ3 open at 30°");
    expectNear(radToDeg(a.outputRad), 101.9285, DEG_TOL, "θ4 open at 30°");
    const b = fourBarPositionRads(l, degToRad(135), "crossed")!;
    expectNear(radToDeg(b.couplerRad), -47.5082, DEG_TOL, "θ3 crossed at 135°");
    expectNear(radToDeg(b.outputRad), -141.3495, DEG_TOL, "θ4 crossed at 135°");
    // The crank of a crank-rocker turns fully: it assembles at every input angle.
    for (let t = -180; t <= 180; t += 10) expect(fourBarPositionRads(l, degToRad(t), "open")).not.toBeNull();
  });
});
