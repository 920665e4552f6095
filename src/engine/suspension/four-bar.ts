import { angleNormalizeRads } from "../math/angle";

/**
 * Link lengths of a planar four-bar, mm, in Norton's labelling: input crank a (link 2), coupler b (3),
 * output rocker c (4), ground d (1). Ground pivots O2 = (0, 0) and O4 = (d, 0).
 */
export interface FourBarLinks {
  readonly inputMm: number;
  readonly couplerMm: number;
  readonly outputMm: number;
  readonly groundMm: number;
}

/** "open" takes the − root of Norton's closed form, "crossed" the + root. */
export type FourBarBranch = "open" | "crossed";

/** Coupler angle θ3 and output angle θ4, radians from the ground line, counter-clockwise, in (−π, π]. */
export interface FourBarAngles {
  readonly couplerRad: number;
  readonly outputRad: number;
}

/** Norton's constants K1…K5 for a link set (dimensionless). */
export interface FourBarConstants {
  readonly k1: number;
  readonly k2: number;
  readonly k3: number;
  readonly k4: number;
  readonly k5: number;
}

/** K1 = d/a, K2 = d/c, K3 = (a² − b² + c² + d²)/(2ac), K4 = d/b, K5 = (c² − d² − a² − b²)/(2ab). */
export function fourBarConstants(l: FourBarLinks): FourBarConstants {
  const a = l.inputMm;
  const b = l.couplerMm;
  const c = l.outputMm;
  const d = l.groundMm;
  return {
    k1: d / a,
    k2: d / c,
    k3: (a * a - b * b + c * c + d * d) / (2 * a * c),
    k4: d / b,
    k5: (c * c - d * d - a * a - b * b) / (2 * a * b),
  };
}

/** Quadratic coefficients of the half-angle forms at input angle θ2 (radians) and their discriminants. */
export interface FourBarCoefficients {
  readonly a: number;
  readonly b: number;
  readonly c: number;
  readonly d: number;
  readonly e: number;
  readonly f: number;
  /** B² − 4AC: negative means the linkage cannot be assembled at this input angle. */
  readonly outputDiscriminant: number;
  /** E² − 4DF, the coupler's discriminant (same sign as the output's). */
  readonly couplerDiscriminant: number;
}

/** Norton's A…F at input angle θ2 (radians): A = cos θ2 − K1 − K2 cos θ2 + K3, B = −2 sin θ2, … */
export function fourBarCoefficients(k: FourBarConstants, inputRad: number): FourBarCoefficients {
  const c2 = Math.cos(inputRad);
  const s2 = Math.sin(inputRad);
  const a = c2 - k.k1 - k.k2 * c2 + k.k3;
  const b = -2 * s2;
  const c = k.k1 - (k.k2 + 1) * c2 + k.k3;
  const d = c2 - k.k1 + k.k4 * c2 + k.k5;
  const e = -2 * s2;
  const f = k.k1 + (k.k4 - 1) * c2 + k.k5;
  return { a, b, c, d, e, f, outputDiscriminant: b * b - 4 * a * c, couplerDiscriminant: e * e - 4 * d * f };
}

/**
 * Closed-form position of a four-bar (Norton, Design of Machinery, ch. 4): coupler and output angles for
 * input angle θ2 (radians, from the ground line, counter-clockwise) on the chosen branch.
 * θ4 = 2·atan2(−B ∓ √(B² − 4AC), 2A), θ3 = 2·atan2(−E ∓ √(E² − 4DF), 2D), − for open, + for crossed.
 * Returns null when the linkage cannot be assembled (negative discriminant); never NaN.
 */
export function fourBarPositionRads(links: FourBarLinks, inputRad: number, branch: FourBarBranch): FourBarAngles | null {
  const co = fourBarCoefficients(fourBarConstants(links), inputRad);
  // A tiny negative discriminant at an exact toggle is rounding, not a failure.
  const tolerance = 1e-12 * (co.b * co.b + Math.abs(4 * co.a * co.c)) + 1e-15;
  if (co.outputDiscriminant < -tolerance || co.couplerDiscriminant < -tolerance) return null;
  const sign = branch === "open" ? -1 : 1;
  const r4 = Math.sqrt(Math.max(0, co.outputDiscriminant));
  const r3 = Math.sqrt(Math.max(0, co.couplerDiscriminant));
  return {
    outputRad: angleNormalizeRads(2 * Math.atan2(-co.b + sign * r4, 2 * co.a)),
    couplerRad: angleNormalizeRads(2 * Math.atan2(-co.e + sign * r3, 2 * co.d)),
  };
}

/** Grashof's condition s + l ≤ p + q (at least one link can turn fully). */
export function fourBarIsGrashof(l: FourBarLinks): boolean {
  const sorted = [l.inputMm, l.couplerMm, l.outputMm, l.groundMm].sort((x, y) => x - y);
  return sorted[0] + sorted[3] <= sorted[1] + sorted[2];
}
