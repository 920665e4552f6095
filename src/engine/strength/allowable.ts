/**
 * Allowable shear stress of a shaft material, MPa, with the source of the rule and of the figure.
 *
 * Distortion energy (von Mises): S_sy = S_y / √3 ≈ 0.577 S_y — Budynas & Nisbett, Shigley's Mechanical
 * Engineering Design, 9th ed., §5-5, eqs. (5-20)/(5-21) (citation key shigley-mde-9e). Maximum shear stress
 * (Tresca): S_sy = 0.5 S_y, the named, more conservative alternative. Printed polymers: the same rule applied
 * to the derated across-layer strength — an extrapolation of a ductile-metal criterion to a bond line, kept
 * only to give a definite rule (common practice).
 *
 * The `source` line names every citation by its key in brackets-free form "(key)"; `citations` lists them.
 */
import { GeometryError } from "../errors";
import { finiteResult, requirePositive } from "../drive/guards";
import type { FigureSource } from "../provenance";
import type { MaterialFigure } from "./materials";

export type ShearCriterion = "distortion-energy" | "tresca";

const CRITERION_SOURCE: Readonly<Record<ShearCriterion, string>> = {
  "distortion-energy": "S_sy = S_y/√3, distortion energy (shigley-mde-9e)",
  tresca: "S_sy = 0.5 S_y, maximum shear stress, the comparison drawn beside the distortion-energy rule (shigley-mde-9e)",
};

const keys = (src: FigureSource) => src.cites.map((k) => `(${k})`).join(" ");

/** Shear yield strength from tensile yield S_y (MPa, > 0) by the chosen criterion, MPa. */
export function shearYieldFromTensileMpa(tensileYieldMpa: number, criterion: ShearCriterion = "distortion-energy"): number {
  const sy = requirePositive(tensileYieldMpa, "material", "tensile strength");
  if (criterion !== "distortion-energy" && criterion !== "tresca") {
    throw new GeometryError("material", `unknown shear criterion "${String(criterion)}"`);
  }
  return finiteResult(criterion === "tresca" ? 0.5 * sy : sy / Math.sqrt(3), "material", "shear yield strength");
}

/** The allowable shear of one material and how it was reached. */
export interface AllowableShear {
  readonly allowableShearMpa: number;
  /** The tensile figure the criterion was applied to, MPa (after the print derate for a printed material). */
  readonly basisStrengthMpa: number;
  readonly basis: "tensile-yield" | "across-layer-derated";
  readonly criterion: ShearCriterion;
  /** 1 for metals. */
  readonly derateFactor: number;
  /** One line naming the rule and the figure's source, each by its citation key. */
  readonly source: string;
  /** The citation keys the line names, rule first. */
  readonly citations: readonly string[];
}

/**
 * Allowable shear stress of a material, MPa: metals S_y by the criterion; printed polymers the across-layer
 * strength × derate factor (in (0, 1]) by the criterion. Throws GeometryError ("material") for a non-positive
 * strength or a derate factor outside (0, 1].
 */
export function allowableShear(material: MaterialFigure, criterion: ShearCriterion = "distortion-energy"): AllowableShear {
  if (material.kind === "metal") {
    const basis = requirePositive(material.yieldStrengthMpa, "material", `yield strength of ${material.name}`);
    return {
      allowableShearMpa: shearYieldFromTensileMpa(basis, criterion),
      basisStrengthMpa: basis,
      basis: "tensile-yield",
      criterion,
      derateFactor: 1,
      source: `${CRITERION_SOURCE[criterion]}; S_y ${basis} MPa of ${material.name}: ${material.strengthSource.note} ${keys(material.strengthSource)}`,
      citations: [...new Set(["shigley-mde-9e", ...material.strengthSource.cites])],
    };
  }
  if (material.kind !== "printed") throw new GeometryError("material", "material kind must be metal or printed");
  const strength = requirePositive(material.acrossLayerStrengthMpa, "material", `across-layer strength of ${material.name}`);
  const derate = requirePositive(material.derateFactor, "material", "print derate factor");
  if (derate > 1) throw new GeometryError("material", `print derate factor ${derate} must not exceed 1`);
  const basis = strength * derate;
  return {
    allowableShearMpa: shearYieldFromTensileMpa(basis, criterion),
    basisStrengthMpa: basis,
    basis: "across-layer-derated",
    criterion,
    derateFactor: derate,
    source:
      `${CRITERION_SOURCE[criterion]} applied to the across-layer strength ${strength} MPa × derate ${derate} ` +
      `of ${material.name}: ${material.strengthSource.note} ${keys(material.strengthSource)}; derate: ${material.derateSource.note} ${keys(material.derateSource)}`,
    citations: [...new Set(["shigley-mde-9e", ...material.strengthSource.cites, ...material.derateSource.cites])],
  };
}
