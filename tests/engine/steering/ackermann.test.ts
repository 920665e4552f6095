import { describe, expect, it } from "vitest";
import {
  ackermannAxisCrossingMm,
  ackermannBicycleAngleDeg,
  ackermannIdealInnerDeg,
  ackermannIdealOuterDeg,
  ackermannInnerReferencePercent,
  ackermannOuterDeviationDeg,
  ackermannOuterReferencePercent,
  ackermannStaticArmPercent,
  ackermannTurnCentrePercent,
  ackermannTurnRadiusMm,
} from "@/engine/steering/ackermann";
import { DEG_TOL, expectNear, expectRel } from "../near";

// REFERENCES §2.3: cot δo − cot δi = w/L ([M] Jazar, Vehicle Dynamics 2nd ed. ch. 7; [M] Gillespie ch. 6),
// w = 200 mm kingpin spacing.
const IDEAL: [number, number, number, number, number][] = [
  [260, 20, 15.8735, 814.344, 17.707],
  [260, 30, 21.7913, 550.333, 25.288],
  [260, 40, 27.0192, 409.856, 32.3898],
  [290, 20, 16.2218, 896.768, 17.9203],
  [290, 30, 22.4373, 602.295, 25.7104],
  [290, 40, 27.9914, 445.609, 33.0559],
  [330, 20, 16.6042, 1006.668, 18.1499],
  [330, 30, 23.1562, 671.577, 26.1686],
  [330, 40, 29.0842, 493.279, 33.7822],
];

describe("ideal Ackermann angles (REFERENCES §2.3)", () => {
  it.each(IDEAL)("L %d, δi %d° → δo %d°, R %d mm, bicycle %d°", (L, di, dO, R, bike) => {
    expectNear(ackermannIdealOuterDeg(di, 200, L), dO, DEG_TOL, "ideal outer");
    expectNear(ackermannTurnRadiusMm(di, 200, L), R, 5e-4, "R (table rounded to 0.001 mm)");
    expectNear(ackermannBicycleAngleDeg(di, dO), bike, DEG_TOL, "bicycle angle");
    expectNear(ackermannIdealInnerDeg(dO, 200, L), di, DEG_TOL, "inverse");
    expectNear(ackermannTurnCentrePercent(di, ackermannIdealOuterDeg(di, 200, L), 200, L), 100, 1e-9, "P_cot of the ideal pair");
  });

  it("full-size case L 2700, w 1500 (REFERENCES §2.3, constructed there): R 10000 → 16.2721° / 14.0989°", () => {
    const di = (Math.atan(2700 / (10000 - 750)) * 180) / Math.PI;
    expectNear(di, 16.2721, DEG_TOL, "δi");
    expectNear(ackermannIdealOuterDeg(di, 1500, 2700), 14.0989, DEG_TOL, "δo");
    expectNear(ackermannBicycleAngleDeg(di, 14.0989), 15.1096, DEG_TOL, "bicycle");
    const di6 = (Math.atan(2700 / (6000 - 750)) * 180) / Math.PI;
    expectNear(di6, 27.2161, DEG_TOL, "δi at R 6000");
    expectNear(ackermannIdealOuterDeg(di6, 1500, 2700), 21.8014, DEG_TOL, "δo at R 6000");
  });

  // Own worked case, constructed by hand from Gillespie's low-speed turning relations (Fundamentals of Vehicle
  // Dynamics, ch. 6 [M]): on a wide turn the single-track angle tends to the small-angle Ackermann angle L/R.
  it("own case: L 2800, w 1500, R = 50 L → bicycle angle atan(L/R) = 1.14576°, within 0.02 % of L/R = 1.14592°", () => {
    const L = 2800;
    const R = 50 * L;
    const di = (Math.atan(L / (R - 750)) * 180) / Math.PI;
    const dO = (Math.atan(L / (R + 750)) * 180) / Math.PI;
    expectNear(ackermannTurnCentrePercent(di, dO, 1500, L), 100, 1e-7, "P_cot");
    const bike = ackermannBicycleAngleDeg(di, dO);
    expectNear(bike, 1.14576, 1e-5, "bicycle angle");
    expectRel(bike, 1.14592, 2e-4, "small-angle L/R");
  });
});

// REFERENCES §2.4: the conventions give different numbers for the same angle pair.
const CONVENTIONS: [number, number, number, number, number, number, number, number, number | null][] = [
  [30, 25, 260, 36.0219, 21.7913, 45.364, 60.911, 53.619, 484.9],
  [30, 21.7868, 260, 29.9919, 21.7913, 100.099, 100.055, 100.074, 259.808],
  [30, 26, 290, 36.3138, 22.4373, 38.783, 52.891, 46.147, 628.431],
  [40, 30, 330, 41.6085, 29.0842, 86.144, 91.61, 89.149, 370.167],
  [20, 22, 260, 30.3795, 15.8735, -23.868, -48.467, -35.411, -734.24],
];

describe("Ackermann percentage conventions (REFERENCES §2.2/§2.4)", () => {
  it.each(CONVENTIONS)("δi %d°, δo %d°, L %d", (di, dO, L, diIdeal, doIdeal, pOut, pIn, pCot, xStar) => {
    expectNear(ackermannIdealInnerDeg(dO, 200, L), diIdeal, DEG_TOL, "δi ideal");
    expectNear(ackermannIdealOuterDeg(di, 200, L), doIdeal, DEG_TOL, "δo ideal");
    expectNear(ackermannOuterReferencePercent(di, dO, 200, L), pOut, 1e-3, "P_out");
    expectNear(ackermannInnerReferencePercent(di, dO, 200, L), pIn, 1e-3, "P_in");
    expectNear(ackermannTurnCentrePercent(di, dO, 200, L), pCot, 1e-3, "P_cot");
    expectRel(ackermannAxisCrossingMm(di, dO, 200), xStar!, 1e-5, "x*");
    // P_cot = L/x* × 100 exactly (REFERENCES §2.2 [D]).
    expectRel(ackermannTurnCentrePercent(di, dO, 200, L), (L / ackermannAxisCrossingMm(di, dO, 200)) * 100, 1e-12, "P_cot = L/x*");
  });

  it("parallel steer is 0 % in every convention", () => {
    expect(ackermannTurnCentrePercent(30, 30, 200, 260)).toBeCloseTo(0, 12);
    expect(ackermannInnerReferencePercent(30, 30, 200, 260)).toBe(0);
    expect(ackermannOuterReferencePercent(30, 30, 200, 260)).toBe(0);
  });

  it("forum numbers (physicsforums thread [F], via REFERENCES §2.4): inner 38.25°, outer 29.35°, w/L 0.767361", () => {
    const L = 1000;
    const w = 767.361;
    expectNear(ackermannIdealOuterDeg(38.25, w, L), 26.16, 1e-3, "ideal outer");
    expectNear(ackermannInnerReferencePercent(38.25, 29.35, w, L), 73.615, 2e-3, "P_in");
    expectNear(ackermannTurnCentrePercent(38.25, 29.35, w, L), 66.442, 2e-3, "P_cot");
    expectNear(ackermannOuterReferencePercent(38.25, 29.35, w, L), 58.029, 2e-3, "P_out");
    expectNear(ackermannIdealInnerDeg(29.35, w, L), 44.6872, DEG_TOL, "δi ideal");
  });

  it("P_static arm rule: 21.0375° is '100 %' at L 260, w 200; 15° gives 69.667 % (REFERENCES §2.4)", () => {
    expectNear(ackermannStaticArmPercent(21.0375, 200, 260), 100, 1e-3, "classic rule");
    expectNear(ackermannStaticArmPercent(15, 200, 260), 69.667, 1e-3, "15°");
  });

  it("deviation δo − δo,ideal (diracdelta glossary [F]): +2.1235° for the 30° trapezoid row of §2.5", () => {
    expectNear(ackermannOuterDeviationDeg(30, 23.9148, 200, 260), 2.1235, DEG_TOL, "deviation");
  });
});
