/**
 * Torque carried by one drive shaft, from the motor through the gearing (REFERENCES §6.2).
 * Units: motor torque N·m, currents A, voltage V, resistance Ω, speed constant rpm/V; shaft torque N·mm.
 */
import { GeometryError } from "../errors";
import { finiteResult, requireFinite, requireNonNegative, requirePositive } from "../drive/guards";

const MOTOR = "motor";
const GEARING = "gearing";

/**
 * Where the motor torque comes from:
 * - "torque": a known torque, N·m, > 0;
 * - "kv": speed constant (rpm/V) and current (A), optionally less the no-load current I₀ (A):
 *   T_m = K_t · (I − I₀), K_t = 60 / (2π K_v).
 */
export type MotorTorqueSource =
  | { readonly kind: "torque"; readonly torqueNm: number }
  | { readonly kind: "kv"; readonly kvRpmPerV: number; readonly currentA: number; readonly noLoadCurrentA?: number };

/**
 * Torque constant of an ideal motor from its speed constant: K_t = 60 / (2π K_v), N·m/A, with K_v in rpm/V (> 0).
 * [F] Wikipedia "Motor constants", via REFERENCES §6.2.
 */
export function torqueConstantNmPerA(kvRpmPerV: number): number {
  requirePositive(kvRpmPerV, MOTOR, "speed constant Kv");
  return finiteResult(60 / (2 * Math.PI * kvRpmPerV), MOTOR, "torque constant");
}

/** Stall current of a brushed motor, I = V / R, A; V ≥ 0 in volts, R > 0 in ohms (REFERENCES §6.2). */
export function brushedStallCurrentA(voltageV: number, resistanceOhm: number): number {
  requireNonNegative(voltageV, MOTOR, "supply voltage");
  requirePositive(resistanceOhm, MOTOR, "winding resistance");
  return finiteResult(voltageV / resistanceOhm, MOTOR, "stall current");
}

/** Stall torque of a brushed motor, K_t · V / R, N·m (REFERENCES §6.2). */
export function brushedStallTorqueNm(kvRpmPerV: number, voltageV: number, resistanceOhm: number): number {
  return finiteResult(torqueConstantNmPerA(kvRpmPerV) * brushedStallCurrentA(voltageV, resistanceOhm), MOTOR, "stall torque");
}

/**
 * Motor torque, N·m, > 0. For "kv" the current above no-load, I − I₀, must be positive.
 * Throws GeometryError ("motor") for a non-positive or non-finite figure.
 */
export function motorTorqueNm(motor: MotorTorqueSource): number {
  if (motor.kind === "torque") return requirePositive(motor.torqueNm, MOTOR, "motor torque");
  const current = requireFinite(motor.currentA, MOTOR, "motor current");
  const noLoad = motor.noLoadCurrentA === undefined ? 0 : requireNonNegative(motor.noLoadCurrentA, MOTOR, "no-load current");
  if (current - noLoad <= 0) {
    throw new GeometryError(MOTOR, `current ${current} A must exceed the no-load current ${noLoad} A to make torque`);
  }
  return finiteResult(torqueConstantNmPerA(motor.kvRpmPerV) * (current - noLoad), MOTOR, "motor torque");
}

/**
 * Overall reduction N from motor to wheel: the product of the stage ratios (each driven / driving, > 0),
 * e.g. [76 / 22, 2.6] for spur/pinion then the transmission or diff. An empty list means direct drive (1).
 */
export function overallRatio(ratios: readonly number[]): number {
  if (!Array.isArray(ratios)) throw new GeometryError(GEARING, "ratios must be a list of numbers");
  const product = ratios.reduce((n, r, i) => n * requirePositive(r, GEARING, `ratio of stage ${i + 1}`), 1);
  return finiteResult(product, GEARING, "overall ratio");
}

/**
 * Torque in one drive shaft, N·mm: T = T_m · N · η / n (REFERENCES §6.2 [C]), with T_m in N·m, N the product of
 * the stage ratios, η the drivetrain efficiency in (0, 1] (1 is conservative) and n ≥ 1 the number of shafts
 * that share the torque in the worst case (e.g. the number of driven axles, since with a spool or one wheel
 * lifted one shaft carries its axle's share).
 */
export function shaftTorqueNmm(p: {
  readonly motorTorqueNm: number;
  readonly ratios: readonly number[];
  readonly efficiency: number;
  readonly shaftsSharing: number;
}): number {
  const motor = requirePositive(p.motorTorqueNm, MOTOR, "motor torque");
  const efficiency = requirePositive(p.efficiency, GEARING, "efficiency");
  if (efficiency > 1) throw new GeometryError(GEARING, `efficiency ${efficiency} must not exceed 1`);
  const share = requireFinite(p.shaftsSharing, GEARING, "number of shafts sharing the torque");
  if (share < 1) throw new GeometryError(GEARING, `number of shafts sharing the torque must be at least 1 (got ${share})`);
  return finiteResult((motor * overallRatio(p.ratios) * efficiency * 1000) / share, "drive shaft", "shaft torque");
}
