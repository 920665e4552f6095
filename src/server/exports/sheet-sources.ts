import "server-only";
// The sign convention and the sources of each figure on a sheet: the sign from the engine's table of
// outputs (OUTPUT_FIELDS), the sources from the figure's methods entry, each a full citation named by its
// stable key (an anchor of the public methods page), the material's own citations last.
import { OUTPUT_FIELDS, type AnalysisResult } from "@/engine";
import { citationByKey } from "@/engine/methods/citations";
import { methodByKey } from "@/engine/methods/method-entries";

/** The engine output behind each sheet figure whose sign the sheet states (ids of src/figures). */
const FIGURE_FIELDS: Record<string, string> = {
  "steer-lock-worst": "steerLock.*.innerDeg",
  "steer-lock-static": "steerLock.*.innerDeg",
  "joint-max": "drive.maxJointAngleWithinLockDeg",
  "joint-max-envelope": "drive.maxJointAngleDeg",
  "stop-clearance": "steeringStop.clearanceAtStopMm",
  "camber-bump": "travel[].camberDeg",
  "camber-droop": "travel[].camberDeg",
  "camber-gain": "travel[].camberGainDegPerMm",
  "roll-centre": "travel[].rollCentreHeightMm",
  ackermann: "ackermann.atLockPct",
  kpi: "travel[].kingpinInclinationDeg",
  caster: "steerAxis.casterDeg",
  scrub: "travel[].scrubRadiusMm",
  trail: "steerAxis.casterTrailMm",
  "safety-factor": "strength.safetyFactor",
  "shaft-torque": "strength.shaftTorqueNmm",
  "shear-stress": "strength.shearStressMpa",
  "allowable-shear": "strength.allowableShearMpa",
};

const FIELDS = new Map(OUTPUT_FIELDS.map((f) => [f.path, f]));

/** The sign convention of a figure, as the engine states it; null for a figure without one. */
export function figureSign(id: string): string | null {
  const field = FIELDS.get(FIGURE_FIELDS[id] ?? "");
  return !field || field.sign === "—" ? null : field.sign;
}

export interface SourceLine {
  /** The figures this source serves, by their labels. */
  readonly figure: string;
  /** The full citation and its key: "… [key]". */
  readonly source: string;
  readonly key: string;
}

const line = (key: string, figures: readonly string[]): SourceLine => ({ figure: figures.join(", "), source: `${citationByKey(key).text} [${key}]`, key });

/**
 * The sheet's sources, one line per citation, in the order of the figures (each line names the figures it
 * rests on), then the material strength's citations.
 */
export function sheetSources(a: AnalysisResult, figures: readonly { readonly id: string; readonly label: string; readonly method: string }[]): SourceLine[] {
  const byKey = new Map<string, string[]>();
  for (const f of figures) {
    for (const key of methodByKey(f.method).cites) {
      const names = byKey.get(key) ?? [];
      if (!names.includes(f.label)) names.push(f.label);
      byKey.set(key, names);
    }
  }
  const lines = [...byKey].map(([key, names]) => line(key, names));
  for (const key of a.strength.allowableCitations) lines.push(line(key, ["Allowable shear of the material"]));
  return lines;
}

/** How to read the keys: each is an entry of the methods page, which says how the product knows the source. */
export const SOURCE_KEYS_NOTE = "Sources by key: each [key] is a citation on the methods page (/methods#key), with how the product knows it (read, recalled, derived here and checked, or common practice).";
