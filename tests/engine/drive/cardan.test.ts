import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GeometryError } from "@/engine/errors";
import {
  cardanAngleForFluctuationDeg,
  cardanOutputAccelerationPerInputSpeedSquared,
  cardanOutputAngleDeg,
  cardanSpeedFluctuation,
  cardanSpeedRatio,
  twoJointEquivalentAngleDeg,
  twoJointOutputAngleDeg,
  twoJointSpeedRatio,
} from "@/engine/drive/cardan";

const ANGLE_TOL_DEG = 1e-3;
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe("single cardan, convention A — REFERENCES §1.3 (ratio: MathWorks 'Universal Joint' page [F, via REFERENCES §1.1])", () => {
  it.each([
    { beta: 20, t1: 0, ratio: 1.064178, t2: 0 },
    { beta: 20, t1: 45, ratio: 0.998069, t2: 46.7808 },
    { beta: 20, t1: 90, ratio: 0.939693, t2: 90 },
    { beta: 30, t1: 30, ratio: 1.065877, t2: 33.6901 },
    { beta: 30, t1: 60, ratio: 0.92376, t2: 63.4349 },
  ])("β $beta°, θ1 $t1° → ω2/ω1 $ratio, θ2 $t2°", ({ beta, t1, ratio, t2 }) => {
    expect(rel(cardanSpeedRatio(beta, t1), ratio)).toBeLessThan(1e-4);
    expect(Math.abs(cardanOutputAngleDeg(beta, t1) - t2)).toBeLessThan(ANGLE_TOL_DEG);
  });

  it("the ratio is the derivative of θ2(θ1): central difference at β 30°, θ1 30° gives 1.065877 (REFERENCES §1.3)", () => {
    const h = 1e-4;
    const numeric = (cardanOutputAngleDeg(30, 30 + h) - cardanOutputAngleDeg(30, 30 - h)) / (2 * h);
    expect(rel(numeric, 1.065877)).toBeLessThan(1e-4);
  });

  it("keeps the quadrant and the turn: θ2 follows θ1 through 90°, 270° and beyond a revolution", () => {
    expect(Math.abs(cardanOutputAngleDeg(30, 120) - (180 - 63.4349))).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(cardanOutputAngleDeg(30, 390) - (360 + 33.6901))).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(cardanOutputAngleDeg(30, -30) + 33.6901)).toBeLessThan(ANGLE_TOL_DEG);
  });

  it("acceleration: β 30°, θ1 45° → α2/ω1² = −0.282784 (derived, REFERENCES §1.1 [D])", () => {
    expect(rel(cardanOutputAccelerationPerInputSpeedSquared(30, 45), -0.282784)).toBeLessThan(1e-4);
    // and it is d(ratio)/dθ1 in rad: central difference as an independent check
    const h = 1e-4;
    const numeric = ((cardanSpeedRatio(25, 70 + h) - cardanSpeedRatio(25, 70 - h)) / (2 * h)) * (180 / Math.PI);
    expect(rel(cardanOutputAccelerationPerInputSpeedSquared(25, 70), numeric)).toBeLessThan(1e-6);
  });
});

describe("speed fluctuation and cardan error — REFERENCES §1.3 (derived, REFERENCES §1.1 [D])", () => {
  it.each([
    { beta: 10, max: 1.015427, min: 0.984808, u: 0.030619, pm: 1.531, err: 0.4386, at: 44.7807 },
    { beta: 20, max: 1.064178, min: 0.939693, u: 0.124485, pm: 6.224, err: 1.7817, at: 44.1092 },
    { beta: 30, max: 1.154701, min: 0.866025, u: 0.288675, pm: 14.434, err: 4.1172, at: 42.9414 },
    { beta: 45, max: 1.414214, min: 0.707107, u: 0.707107, pm: 35.355, err: 9.8793, at: 40.0604 },
  ])("β $beta° → U $u, ±$pm %, Δmax $err° at $at°", ({ beta, max, min, u, pm, err, at }) => {
    const f = cardanSpeedFluctuation(beta);
    expect(rel(f.maxRatio, max)).toBeLessThan(1e-4);
    expect(rel(f.minRatio, min)).toBeLessThan(1e-4);
    expect(rel(f.fluctuation, u)).toBeLessThan(1e-4);
    expect(Math.abs(f.plusMinusPercent - pm)).toBeLessThan(1e-3); // the sheet gives 3 decimals
    expect(Math.abs(f.cardanErrorDeg - err)).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(f.cardanErrorAtInputDeg - at)).toBeLessThan(ANGLE_TOL_DEG);
  });

  it("the cardan error matches a sampled maximum of θ2 − θ1 (independent numerical check)", () => {
    let best = 0;
    let bestAt = 0;
    for (let i = 0; i <= 90_000; i++) {
      const t1 = i / 1000;
      const lead = cardanOutputAngleDeg(30, t1) - t1;
      if (lead > best) [best, bestAt] = [lead, t1];
    }
    const f = cardanSpeedFluctuation(30);
    expect(Math.abs(best - f.cardanErrorDeg)).toBeLessThan(1e-6);
    expect(Math.abs(bestAt - f.cardanErrorAtInputDeg)).toBeLessThan(2e-3);
  });

  it("Elbe Group guidance U ≤ 0.0027 corresponds to β = 2.9765° [F, via REFERENCES §1.1/§1.3]", () => {
    expect(Math.abs(cardanAngleForFluctuationDeg(0.0027) - 2.9765)).toBeLessThan(ANGLE_TOL_DEG);
    expect(rel(cardanSpeedFluctuation(cardanAngleForFluctuationDeg(0.3)).fluctuation, 0.3)).toBeLessThan(1e-12);
  });

  it("Hooke's joint, cos² form as in Rattan, Theory of Machines, and Uicker, Pennock & Shigley [M]: β = 60° worked by hand", () => {
    // Our own hand arithmetic from the textbook formula (not the books' numbers): cos 60° = 1/2, sin² 60° = 3/4.
    // Extremes 1/cos β = 2 and cos β = 1/2; at θ1 = 45°: ω2/ω1 = 0.5/(1 − 0.75·0.5) = 0.8, tan θ2 = 1/0.5 → θ2 = atan 2.
    const f = cardanSpeedFluctuation(60);
    expect(rel(f.maxRatio, 2)).toBeLessThan(1e-12);
    expect(rel(f.minRatio, 0.5)).toBeLessThan(1e-12);
    expect(rel(f.fluctuation, 1.5)).toBeLessThan(1e-12);
    expect(rel(cardanSpeedRatio(60, 45), 0.8)).toBeLessThan(1e-12);
    expect(Math.abs(cardanOutputAngleDeg(60, 45) - (Math.atan(2) * 180) / Math.PI)).toBeLessThan(1e-9);
  });

  it("the mean output speed equals the input speed (Uicker, Pennock & Shigley; Rattan [M]): ratio averages to 1", () => {
    const n = 36_000;
    let sum = 0;
    for (let i = 0; i < n; i++) sum += cardanSpeedRatio(35, (360 * (i + 0.5)) / n);
    expect(Math.abs(sum / n - 1)).toBeLessThan(1e-9);
  });
});

describe("two joints in series and the double cardan — derived, REFERENCES §1.2 [D]", () => {
  it("in phase with equal bends the output copies the input exactly", () => {
    for (const t1 of [0, 17, 45, 91, 200, 333]) {
      expect(Math.abs(twoJointOutputAngleDeg(25, 25, "in-phase", t1) - t1)).toBeLessThan(1e-9);
      expect(Math.abs(twoJointSpeedRatio(25, 25, "in-phase", t1) - 1)).toBeLessThan(1e-12);
    }
    expect(twoJointEquivalentAngleDeg(25, 25, "in-phase")).toBe(0);
  });

  it("matches chaining two single joints (joint 2 met in convention B in phase, in convention A out of phase)", () => {
    for (const t1 of [10, 50, 130, 260]) {
      const middle = cardanOutputAngleDeg(30, t1);
      // in phase: tan θ3 = tan θm·cos β2, so joint 2 (convention A) driven from θ3 gives θm back
      expect(Math.abs(cardanOutputAngleDeg(12, twoJointOutputAngleDeg(30, 12, "in-phase", t1)) - middle)).toBeLessThan(1e-9);
      expect(Math.abs(twoJointOutputAngleDeg(30, 12, "out-of-phase", t1) - cardanOutputAngleDeg(12, middle))).toBeLessThan(1e-9);
    }
  });

  it("the equivalent angle gives the pair's sampled speed extremes (in and out of phase)", () => {
    for (const phasing of ["in-phase", "out-of-phase"] as const) {
      const eq = twoJointEquivalentAngleDeg(30, 12, phasing);
      let lo = Infinity;
      let hi = -Infinity;
      for (let i = 0; i < 3600; i++) {
        const r = twoJointSpeedRatio(30, 12, phasing, i / 10);
        lo = Math.min(lo, r);
        hi = Math.max(hi, r);
      }
      const f = cardanSpeedFluctuation(eq);
      expect(rel(hi, f.maxRatio)).toBeLessThan(1e-9);
      expect(rel(lo, f.minRatio)).toBeLessThan(1e-9);
    }
    // cos β_eq = cos 30°/cos 12° in phase, cos 30°·cos 12° out of phase
    const c = (d: number) => Math.cos((d * Math.PI) / 180);
    expect(rel(Math.cos((twoJointEquivalentAngleDeg(30, 12, "in-phase") * Math.PI) / 180), c(30) / c(12))).toBeLessThan(1e-12);
    expect(rel(Math.cos((twoJointEquivalentAngleDeg(12, 30, "out-of-phase") * Math.PI) / 180), c(30) * c(12))).toBeLessThan(1e-12);
  });

  it("small-angle forms: β_eq² ≈ β1² − β2² in phase, β1² + β2² out of phase (derived [D]; driveline makers' rule as recalled [M])", () => {
    const eqIn = twoJointEquivalentAngleDeg(6, 4, "in-phase");
    const eqOut = twoJointEquivalentAngleDeg(6, 4, "out-of-phase");
    expect(Math.abs(eqIn - Math.sqrt(36 - 16))).toBeLessThan(0.01);
    expect(Math.abs(eqOut - Math.sqrt(36 + 16))).toBeLessThan(0.01);
  });
});

describe("cardan — ranges and properties", () => {
  it("a bend of 90° or more, or a non-finite angle, is a named error", () => {
    for (const fn of [
      () => cardanSpeedRatio(90, 0),
      () => cardanSpeedFluctuation(120),
      () => cardanOutputAngleDeg(30, Number.NaN),
      () => cardanAngleForFluctuationDeg(-0.1),
      () => twoJointEquivalentAngleDeg(20, 10, "sideways" as never),
    ]) {
      expect(fn).toThrow(GeometryError);
    }
  });

  it("the speed ratio stays between cos β and 1/cos β, finite, for any valid input (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: -89.9, max: 89.9, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }), (beta, t1) => {
        const c = Math.cos((beta * Math.PI) / 180);
        const r = cardanSpeedRatio(beta, t1);
        const values = [r, cardanOutputAngleDeg(beta, t1), cardanOutputAccelerationPerInputSpeedSquared(beta, t1)];
        return values.every(Number.isFinite) && r >= c * (1 - 1e-12) && r <= (1 / c) * (1 + 1e-12);
      }),
    );
  });
});
