/**
 * Will this shaft neck survive the motor's torque? One call from motor to safety factor.
 *
 * Expected input shape (plain JSON; the layout contract maps onto it):
 * ```
 * {
 *   motor: { kind: "torque", torqueNm } | { kind: "kv", kvRpmPerV, currentA, noLoadCurrentA? },
 *   ratios: number[],            // stage ratios, driven/driving, e.g. [76/22, 2.6]
 *   efficiency: number,          // (0, 1]; 1 is conservative
 *   shaftsSharing: number,       // ≥ 1, worst-case number of shafts sharing the motor torque
 *   neck: { diameterMm, boreMm?, twistLengthMm? },
 *   material: MaterialFigure,    // from MATERIALS or the workspace shelf
 *   targetSafetyFactor: number,  // > 0, e.g. 2–3 for printed parts
 *   criterion?: "distortion-energy" | "tresca",   // default distortion energy
 *   neckWhatIfMm?: number[],     // diameters to compare; default the neck ± 0.5 and ± 1 mm
 *   crossPin?: { contactRadiusMm, pinDiameterMm, material? }   // pin material defaults to the shaft's
 * }
 * ```
 * Every stress in MPa, torque in N·mm unless the name says N·m. Throws GeometryError naming the part for any
 * invalid or impossible input; never returns NaN or Infinity.
 */
import { GeometryError } from "../errors";
import { finiteResult, requirePositive } from "../drive/guards";
import { allowableShear, type ShearCriterion } from "./allowable";
import { crossPinLoad } from "./cross-pin";
import type { MaterialFigure } from "./materials";
import { motorTorqueNm, overallRatio, shaftTorqueNmm, type MotorTorqueSource } from "./torque-chain";
import { minimumNeckDiameterMm, torsionalShearStressMpa, twistAngleDeg } from "./torsion";

export * from "./allowable";
export * from "./calibration";
export * from "./cross-pin";
export * from "./materials";
export * from "./torque-chain";
export * from "./torsion";

/** Largest what-if list one analysis accepts (keeps a request's cost bounded). */
export const NECK_WHAT_IF_LIMIT = 64;

export interface StrengthInput {
  readonly motor: MotorTorqueSource;
  readonly ratios: readonly number[];
  readonly efficiency: number;
  readonly shaftsSharing: number;
  readonly neck: { readonly diameterMm: number; readonly boreMm?: number; readonly twistLengthMm?: number };
  readonly material: MaterialFigure;
  readonly targetSafetyFactor: number;
  readonly criterion?: ShearCriterion;
  readonly neckWhatIfMm?: readonly number[];
  readonly crossPin?: { readonly contactRadiusMm: number; readonly pinDiameterMm: number; readonly material?: MaterialFigure };
}

export interface NeckWhatIf {
  readonly neckDiameterMm: number;
  readonly shearStressMpa: number;
  readonly safetyFactor: number;
  readonly meetsTarget: boolean;
}

export interface StrengthResult {
  readonly motorTorqueNm: number;
  readonly overallRatio: number;
  /** Torque in the one shaft checked, N·mm. */
  readonly shaftTorqueNmm: number;
  /** τ_max at the neck surface, MPa. */
  readonly shearStressMpa: number;
  readonly allowableShearMpa: number;
  /** The rule and the material's figure, each naming its citation key in parentheses. */
  readonly allowableSource: string;
  /** Citation keys (anchors of the methods page) of the rule and the figure. */
  readonly allowableCitations: readonly string[];
  readonly allowableCriterion: ShearCriterion;
  readonly allowableBasis: "tensile-yield" | "across-layer-derated";
  /** allowable / τ_max, dimensionless, > 0. */
  readonly safetyFactor: number;
  readonly targetSafetyFactor: number;
  readonly meetsTarget: boolean;
  /** Smallest outer diameter (same bore) that meets the target, mm. */
  readonly minimumNeckDiameterMm: number;
  /** Twist over neck.twistLengthMm, degrees; present only when that length and the material's G are known. */
  readonly twistDeg?: number;
  readonly neckWhatIf: readonly NeckWhatIf[];
  readonly crossPin?: {
    readonly forcePerEndN: number;
    readonly shearStressMpa: number;
    readonly allowableShearMpa: number;
    readonly safetyFactor: number;
    readonly meetsTarget: boolean;
  };
}

function defaultWhatIf(diameterMm: number, boreMm: number): number[] {
  return [-1, -0.5, 0, 0.5, 1].map((step) => diameterMm + step).filter((d) => d > boreMm && d > 0);
}

/** Shaft torque, neck shear, allowable, safety factor and a what-if over neck diameter (see the module comment). */
export function analyzeStrength(input: StrengthInput): StrengthResult {
  for (const [part, value] of [["motor", input?.motor], ["shaft neck", input?.neck], ["material", input?.material]] as const) {
    if (typeof value !== "object" || value === null) throw new GeometryError(part, "is missing");
  }
  const criterion = input.criterion ?? "distortion-energy";
  const target = requirePositive(input.targetSafetyFactor, "drive shaft", "target safety factor");
  const motorNm = motorTorqueNm(input.motor);
  const ratio = overallRatio(input.ratios);
  const torque = shaftTorqueNmm({ motorTorqueNm: motorNm, ratios: input.ratios, efficiency: input.efficiency, shaftsSharing: input.shaftsSharing });
  const allowable = allowableShear(input.material, criterion);
  const bore = input.neck.boreMm ?? 0;

  const check = (diameterMm: number): NeckWhatIf => {
    const stress = torsionalShearStressMpa(torque, { diameterMm, boreMm: input.neck.boreMm });
    const safetyFactor = finiteResult(allowable.allowableShearMpa / stress, "drive shaft", "safety factor");
    return { neckDiameterMm: diameterMm, shearStressMpa: stress, safetyFactor, meetsTarget: safetyFactor >= target };
  };
  const actual = check(input.neck.diameterMm);

  const whatIfDiameters = input.neckWhatIfMm ?? defaultWhatIf(input.neck.diameterMm, bore);
  if (!Array.isArray(whatIfDiameters) || whatIfDiameters.length > NECK_WHAT_IF_LIMIT) {
    throw new GeometryError("shaft neck", `what-if list must hold at most ${NECK_WHAT_IF_LIMIT} diameters`);
  }

  const G = input.material.shearModulusMpa;
  const length = input.neck.twistLengthMm;
  const twistDeg =
    length !== undefined && G !== undefined
      ? twistAngleDeg(torque, length, G, { diameterMm: input.neck.diameterMm, boreMm: input.neck.boreMm })
      : undefined;

  let crossPin: StrengthResult["crossPin"];
  if (input.crossPin) {
    const load = crossPinLoad({ torqueNmm: torque, contactRadiusMm: input.crossPin.contactRadiusMm, pinDiameterMm: input.crossPin.pinDiameterMm });
    const pinAllowable = allowableShear(input.crossPin.material ?? input.material, criterion).allowableShearMpa;
    const safetyFactor = finiteResult(pinAllowable / load.shearStressMpa, "cross pin", "safety factor");
    crossPin = { ...load, allowableShearMpa: pinAllowable, safetyFactor, meetsTarget: safetyFactor >= target };
  }

  return {
    motorTorqueNm: motorNm,
    overallRatio: ratio,
    shaftTorqueNmm: torque,
    shearStressMpa: actual.shearStressMpa,
    allowableShearMpa: allowable.allowableShearMpa,
    allowableSource: allowable.source,
    allowableCitations: allowable.citations,
    allowableCriterion: criterion,
    allowableBasis: allowable.basis,
    safetyFactor: actual.safetyFactor,
    targetSafetyFactor: target,
    meetsTarget: actual.meetsTarget,
    minimumNeckDiameterMm: minimumNeckDiameterMm({
      shaftTorqueNmm: torque,
      allowableShearMpa: allowable.allowableShearMpa,
      targetSafetyFactor: target,
      boreMm: input.neck.boreMm,
    }),
    ...(twistDeg === undefined ? {} : { twistDeg }),
    neckWhatIf: whatIfDiameters.map(check),
    ...(crossPin ? { crossPin } : {}),
  };
}
