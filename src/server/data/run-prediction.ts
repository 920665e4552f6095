import "server-only";
import type { Layout } from "@/contracts/layout";
import { applyShelfItem, layoutMaterialOf, type MaterialSpec } from "@/contracts/shelf";
import type { RunPrediction, TestSetup } from "@/contracts/test-log";
import { allowableShear, analyzeStrength, materialFigure } from "@/engine";

export interface ShelfMaterial {
  readonly id: string;
  readonly name: string;
  readonly spec: MaterialSpec;
}

/** The layout's strength figures with the material as tested and the motor and gearing as tested. */
export function layoutAsTested(layout: Layout, material: ShelfMaterial, setup: TestSetup): Layout {
  const withMaterial = applyShelfItem(layout, { ...material, kind: "material" });
  return { ...withMaterial, strength: { ...withMaterial.strength, motor: setup.motor, gearRatios: [...setup.gearRatios] } };
}

/**
 * What the engine predicts for a run: the revision's shaft (neck and bore) and drivetrain share and
 * efficiency, with the motor, gearing and material as tested. `neckShearStressMpa` is kept beside the
 * prediction so calibration can judge the run against a later figure of the material.
 */
export function predictRun(layout: Layout, material: ShelfMaterial, setup: TestSetup): { prediction: RunPrediction; neckShearStressMpa: number | null } {
  const l = layoutAsTested(layout, material, setup);
  const m = l.strength.material;
  try {
    const r = analyzeStrength({
      motor: l.strength.motor,
      ratios: l.strength.gearRatios,
      efficiency: l.strength.efficiency,
      shaftsSharing: l.strength.shaftsSharing,
      neck: { diameterMm: l.drive.neckDiameterMm, boreMm: l.drive.boreDiameterMm },
      material: materialFigure(m),
      criterion: m.kind === "custom" ? m.shearRule : undefined,
      targetSafetyFactor: l.strength.targetSafetyFactor,
    });
    return {
      prediction: { ok: true, safetyFactor: r.safetyFactor, shearStressMpa: r.shearStressMpa, allowableShearMpa: r.allowableShearMpa, shaftTorqueNmm: r.shaftTorqueNmm, allowableSource: r.allowableSource },
      neckShearStressMpa: r.shearStressMpa,
    };
  } catch (error) {
    if ((error as { name?: string }).name !== "GeometryError") throw error;
    return { prediction: { ok: false, reason: (error as Error).message }, neckShearStressMpa: null };
  }
}

/** The allowable shear (MPa) of a shelf material's present figures, by its shear rule. */
export function allowableOf(material: ShelfMaterial): number {
  const m = layoutMaterialOf(material);
  return allowableShear(materialFigure(m), m.kind === "custom" ? m.shearRule : undefined).allowableShearMpa;
}
