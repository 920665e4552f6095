/**
 * Shear in the cross pin of a dogbone or CVD end (REFERENCES §6.1, derived [D]): the two pin ends carry the
 * shaft torque as a couple, F = T / (2 r_e) per end, and each end shears on one plane of area π d_p² / 4.
 * Units: torque N·mm, radii and diameters mm, force N, stress MPa.
 */
import { finiteResult, requireFinite, requirePositive } from "../drive/guards";

/** Force on each pin end and the pin's shear stress. */
export interface CrossPinLoad {
  /** F = |T| / (2 r_e), N. */
  readonly forcePerEndN: number;
  /** τ = F / (π d_p² / 4), MPa. */
  readonly shearStressMpa: number;
}

/**
 * Cross-pin load for shaft torque T (N·mm, sign ignored), contact radius r_e > 0 (pin axis to the point where
 * the cup slot pushes on the pin, mm) and pin diameter d_p > 0 (mm). Stress concentrations are not included.
 */
export function crossPinLoad(p: { readonly torqueNmm: number; readonly contactRadiusMm: number; readonly pinDiameterMm: number }): CrossPinLoad {
  const T = Math.abs(requireFinite(p.torqueNmm, "drive shaft", "shaft torque"));
  const r = requirePositive(p.contactRadiusMm, "cross pin", "contact radius");
  const dp = requirePositive(p.pinDiameterMm, "cross pin", "pin diameter");
  const force = finiteResult(T / (2 * r), "cross pin", "force per end");
  return { forcePerEndN: force, shearStressMpa: finiteResult(force / ((Math.PI * dp * dp) / 4), "cross pin", "shear stress") };
}
