/**
 * Single and paired cardan (Hooke) joints, REFERENCES §1.1–1.2.
 *
 * Convention A: the input angle θ1 is 0 when the input yoke's trunnion axis lies in the plane that holds both
 * shafts. β is the bend angle between input and output shafts, degrees, valid in (−90°, 90°) — its sign is
 * ignored; at 90° the joint locks. Angles in degrees, speed ratios dimensionless (ω2/ω1).
 * Sources: [F] MathWorks Simscape Driveline "Universal Joint" page and R. Puetter's universal-joint notes
 * (ratio and output angle); [M] Uicker, Pennock & Shigley and Rattan (cos² form); derived quantities [D].
 */
import { GeometryError } from "../errors";
import { DEG_PER_RAD, RAD_PER_DEG, requireFinite } from "./guards";

const CARDAN = "cardan joint";

function bendRad(betaDeg: number): number {
  const beta = Math.abs(requireFinite(betaDeg, CARDAN, "bend angle")) * RAD_PER_DEG;
  if (beta >= Math.PI / 2) throw new GeometryError(CARDAN, `bend angle ${betaDeg}° locks the joint (must be below 90°)`);
  return beta;
}

function inputRad(thetaDeg: number): number {
  return requireFinite(thetaDeg, CARDAN, "input rotation angle") * RAD_PER_DEG;
}

/** 1 − sin²β cos²θ1, written as cos²β + sin²β sin²θ1 so it keeps its digits near β = 90°. */
function ratioDenominator(betaRad: number, inputRad: number): number {
  return Math.cos(betaRad) ** 2 + (Math.sin(betaRad) * Math.sin(inputRad)) ** 2;
}

/** Puts `angleRad` on the same turn as `nearRad` (within ±π of it). */
function unwrapNear(angleRad: number, nearRad: number): number {
  return nearRad + Math.atan2(Math.sin(angleRad - nearRad), Math.cos(angleRad - nearRad));
}

/**
 * Output rotation θ2 of a single cardan joint for input rotation θ1, degrees, convention A:
 * tan θ2 = tan θ1 / cos β, taken as atan2(sin θ1, cos θ1 cos β) and kept on the same turn as θ1
 * (so θ2 is continuous and never more than a quarter turn from θ1). θ1 any finite angle.
 */
export function cardanOutputAngleDeg(betaDeg: number, inputAngleDeg: number): number {
  const beta = bendRad(betaDeg);
  const t1 = inputRad(inputAngleDeg);
  return unwrapNear(Math.atan2(Math.sin(t1), Math.cos(t1) * Math.cos(beta)), t1) * DEG_PER_RAD;
}

/** Speed ratio ω2/ω1 = cos β / (1 − sin²β cos²θ1) at input angle θ1 (convention A); between cos β and 1/cos β. */
export function cardanSpeedRatio(betaDeg: number, inputAngleDeg: number): number {
  const beta = bendRad(betaDeg);
  return Math.cos(beta) / ratioDenominator(beta, inputRad(inputAngleDeg));
}

/**
 * Output angular acceleration at constant input speed, as α2/ω1² (dimensionless; rad/s² per (rad/s)²):
 * −cos β sin²β sin 2θ1 / (1 − sin²β cos²θ1)² (REFERENCES §1.1 [D], convention A).
 */
export function cardanOutputAccelerationPerInputSpeedSquared(betaDeg: number, inputAngleDeg: number): number {
  const beta = bendRad(betaDeg);
  const t1 = inputRad(inputAngleDeg);
  const s2 = Math.sin(beta) ** 2;
  const denominator = ratioDenominator(beta, t1);
  return (-Math.cos(beta) * s2 * Math.sin(2 * t1)) / (denominator * denominator);
}

/** Speed fluctuation of one cardan joint over a revolution at bend angle β. */
export interface CardanSpeedFluctuation {
  /** Largest ω2/ω1 = 1/cos β, at θ1 = 0°, 180°. */
  readonly maxRatio: number;
  /** Smallest ω2/ω1 = cos β, at θ1 = 90°, 270°. */
  readonly minRatio: number;
  /** Peak-to-peak fluctuation as a fraction of input speed, U = 1/cos β − cos β = sin β tan β. */
  readonly fluctuation: number;
  /** ±U/2 about the mean (which is the input speed), in percent. */
  readonly plusMinusPercent: number;
  /** Largest lead/lag between the shafts, atan[(1 − cos β) / (2√cos β)], degrees. */
  readonly cardanErrorDeg: number;
  /** Input angle at which that lead is reached, atan √cos β, degrees (first quadrant). */
  readonly cardanErrorAtInputDeg: number;
}

/** Speed fluctuation figures of a single cardan joint at bend β, degrees (REFERENCES §1.1 [D]). */
export function cardanSpeedFluctuation(betaDeg: number): CardanSpeedFluctuation {
  const beta = bendRad(betaDeg);
  const c = Math.cos(beta);
  const fluctuation = Math.sin(beta) * Math.tan(beta);
  return {
    maxRatio: 1 / c,
    minRatio: c,
    fluctuation,
    plusMinusPercent: (fluctuation / 2) * 100,
    cardanErrorDeg: Math.atan((1 - c) / (2 * Math.sqrt(c))) * DEG_PER_RAD,
    cardanErrorAtInputDeg: Math.atan(Math.sqrt(c)) * DEG_PER_RAD,
  };
}

/**
 * Bend angle at which a single cardan joint reaches fluctuation U (peak-to-peak fraction, ≥ 0), degrees:
 * sin β tan β = U ⇒ cos β = (√(U² + 4) − U) / 2. Inverse of cardanSpeedFluctuation(β).fluctuation.
 */
export function cardanAngleForFluctuationDeg(fluctuation: number): number {
  const u = requireFinite(fluctuation, CARDAN, "speed fluctuation");
  if (u < 0) throw new GeometryError(CARDAN, `speed fluctuation ${u} must not be negative`);
  // (√(U²+4) − U)/2 written as 2/(√(U²+4) + U) to avoid cancellation at large U.
  return Math.acos(2 / (Math.sqrt(u * u + 4) + u)) * DEG_PER_RAD;
}

/**
 * How the two yokes on the intermediate shaft of a two-joint line are set:
 * "in-phase" — both in one plane (the cancelling arrangement, as in a double cardan joint);
 * "out-of-phase" — turned 90° to each other (the errors add).
 */
export type YokePhasing = "in-phase" | "out-of-phase";

function pairFactor(beta1Deg: number, beta2Deg: number, phasing: YokePhasing): { num: number; den: number } {
  const c1 = Math.cos(bendRad(beta1Deg));
  const c2 = Math.cos(bendRad(beta2Deg));
  if (phasing === "in-phase") return { num: c2, den: c1 }; // tan θ3 = tan θ1 · cos β2 / cos β1
  if (phasing === "out-of-phase") return { num: 1, den: c1 * c2 }; // tan θ3 = tan θ1 / (cos β1 cos β2)
  throw new GeometryError(CARDAN, `unknown yoke phasing "${String(phasing)}"`);
}

/**
 * Output rotation θ3 of two cardan joints in series (bends β1, β2, degrees; input θ1, convention A at joint 1),
 * degrees, on the same turn as θ1 (REFERENCES §1.2 [D]). In phase with β1 = β2 the output copies the input.
 */
export function twoJointOutputAngleDeg(beta1Deg: number, beta2Deg: number, phasing: YokePhasing, inputAngleDeg: number): number {
  const { num, den } = pairFactor(beta1Deg, beta2Deg, phasing);
  const t1 = inputRad(inputAngleDeg);
  return unwrapNear(Math.atan2(Math.sin(t1) * num, Math.cos(t1) * den), t1) * DEG_PER_RAD;
}

/** Speed ratio ω3/ω1 of two joints in series: with tan θ3 = k tan θ1, dθ3/dθ1 = k / (cos²θ1 + k² sin²θ1). */
export function twoJointSpeedRatio(beta1Deg: number, beta2Deg: number, phasing: YokePhasing, inputAngleDeg: number): number {
  const { num, den } = pairFactor(beta1Deg, beta2Deg, phasing);
  const k = num / den;
  const t1 = inputRad(inputAngleDeg);
  return k / (Math.cos(t1) ** 2 + k * k * Math.sin(t1) ** 2);
}

/**
 * Single-joint angle with the same speed fluctuation as the pair, degrees, in [0°, 90°) (REFERENCES §1.2 [D]):
 * in phase cos β_eq = cos β1 / cos β2 (the larger bend's cosine on the bottom, so β_eq² ≈ |β1² − β2²|);
 * out of phase cos β_eq = cos β1 · cos β2 (β_eq² ≈ β1² + β2²). A centred double cardan has β1 = β2 in phase → 0°.
 */
export function twoJointEquivalentAngleDeg(beta1Deg: number, beta2Deg: number, phasing: YokePhasing): number {
  const { num, den } = pairFactor(beta1Deg, beta2Deg, phasing);
  return Math.acos(Math.min(num, den) / Math.max(num, den)) * DEG_PER_RAD;
}
