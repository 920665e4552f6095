import "server-only";
// The sign convention and the formula's source of each figure on a sheet, from the text the engine keeps
// beside every output (OUTPUT_FIELDS) and the material's own source. This file is the one place that
// turns the engine's source text into what a sheet prints: switch it here when the engine's sources change.
import { OUTPUT_FIELDS, type AnalysisResult } from "@/engine";

/** The engine output behind each sheet figure (ids of src/figures/sheet-figures.ts). */
const FIGURE_FIELDS: Record<string, string> = {
  "steer-lock-worst": "steerLock.*.innerDeg",
  "steer-lock-static": "steerLock.*.innerDeg",
  "lock-limit": "steerLock.*.limitedBy",
  "joint-max": "drive.maxJointAngleWithinLockDeg",
  "joint-max-envelope": "drive.maxJointAngleDeg",
  "neck-clearance": "drive.minNeckClearanceMm",
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

/**
 * Our team's own sheet of formulas is not a source a product cites: a mention of it (and of our design
 * notes) is dropped, and what remains names the published source. Null when nothing published remains.
 */
export function publishedPart(text: string): string | null {
  const cleaned = text
    .replace(/\s*\(DESIGN\.md\)/g, "")
    .replace(/(?:[,;]\s*)?(?:via\s+)?REFERENCES\s*§\s*[\d.]+(?:\s*[–-]\s*[\d.]+)?(?:\s*,\s*§\s*[\d.]+)*/g, "")
    .replace(/\(\s*[,;]?\s*/g, "(")
    .replace(/\s*[,;]?\s*\)/g, ")")
    .replace(/\(\)/g, "")
    .replace(/\s{2,}/g, " ")
    .replace(/^[\s,;]+|[\s,;]+$/g, "")
    .replace(/^\(([^()]*)\)$/, "$1");
  // Tags alone ([F]/[D]) or a dash say nothing about where a figure comes from.
  const words = cleaned.replace(/\[[A-Z]\]/g, "").match(/[A-Za-z]{3,}/g);
  return words && cleaned !== "—" ? cleaned : null;
}

/** The sign convention of a figure, as the engine states it; null for a figure without one. */
export function figureSign(id: string): string | null {
  const field = FIELDS.get(FIGURE_FIELDS[id] ?? "");
  if (!field || field.sign === "—") return null;
  return publishedPart(field.sign);
}

export interface SourceLine {
  readonly figure: string;
  readonly source: string;
}

/**
 * Where the sheet's formulas come from, one line per distinct source, in the order of the figures (each
 * line names the figures it serves), and the material strength's own source last.
 */
export function sheetSources(a: AnalysisResult, figures: readonly { readonly id: string; readonly label: string }[]): SourceLine[] {
  const bySource = new Map<string, string[]>();
  for (const f of figures) {
    const field = FIELDS.get(FIGURE_FIELDS[f.id] ?? "");
    const source = field ? publishedPart(field.source) : null;
    if (!source) continue;
    const names = bySource.get(source) ?? [];
    if (!names.includes(f.label)) names.push(f.label);
    bySource.set(source, names);
  }
  const lines = [...bySource].map(([source, names]) => ({ figure: names.join(", "), source }));
  const material = publishedPart(a.strength.allowableSource);
  if (material) lines.push({ figure: "Allowable shear of the material", source: material });
  return lines;
}

/** What the source tags mean (the engine marks each source with them). */
export const SOURCE_TAGS = "[F] found in a published source · [M] recalled from the named book or standard · [D] derived here and checked numerically · [C] common practice";
