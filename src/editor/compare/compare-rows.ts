// Every input and output of two to four layouts as rows side by side, each later item marked against the
// first: better or worse against the targets where a target judges the figure, otherwise changed or the
// same. Pure: the compare page renders these rows.
import type { ComparedItem } from "@/contracts/compare";
import { compareReadout, judgeReadout, type Change, type ReadoutKey, type Verdict } from "@/contracts/targets";
import { MATERIALS, type AnalysisResult } from "@/engine";
import { fmt, limitLabel, signed } from "@/figures/format";
import { FIELD_GROUPS, type FieldDef } from "@/figures/layout-fields";
import { getAt } from "@/figures/layout-paths";
import { formatLength, lengthDigits, mmToUnit, type LengthUnit } from "@/figures/length-unit";

export interface CompareCell {
  readonly text: string;
  /** The figure, for the difference from the first item (null for text, or no figure). */
  readonly value: number | null;
  /** Against the first item; null for the first item itself. */
  readonly change: Change | null;
  readonly crossed: "now-meets" | "now-misses" | null;
  readonly verdict: Verdict;
  /** The difference from the first item, in words ("+2.3°"), when both have a figure and they differ. */
  readonly delta: string | null;
}

export interface CompareRow {
  readonly id: string;
  readonly group: string;
  readonly label: string;
  readonly cells: readonly CompareCell[];
  /** True when any item differs from the first. */
  readonly differs: boolean;
}

type Output = {
  id: string;
  group: string;
  label: string;
  get: (a: AnalysisResult) => number | string | null;
  digits?: number;
  unit?: string;
  length?: boolean;
  signed?: boolean;
  readout?: ReadoutKey;
};

const OUTPUTS: readonly Output[] = [
  { id: "lock", group: "Steer lock", label: "Steer lock, worst over travel (inner)", get: (a) => a.steerLock.worst.innerDeg, digits: 1, unit: "°", readout: "lockDeg" },
  { id: "lock-outer", group: "Steer lock", label: "Outer wheel at that lock", get: (a) => a.steerLock.worst.outerDeg, digits: 1, unit: "°" },
  { id: "lock-by", group: "Steer lock", label: "What limits the lock", get: (a) => limitLabel(a.steerLock.worst.limitedBy) },
  { id: "lock-static", group: "Steer lock", label: "Lock at ride height", get: (a) => a.steerLock.static.innerDeg, digits: 1, unit: "°" },
  { id: "joint-max", group: "Drive joint", label: "Largest joint angle within lock", get: (a) => a.drive.maxJointAngleWithinLockDeg, digits: 1, unit: "°", readout: "maxJointAngleDeg" },
  { id: "joint-limit", group: "Drive joint", label: "Joint limit", get: (a) => a.drive.jointLimitDeg, digits: 1, unit: "°" },
  { id: "joint-limit-by", group: "Drive joint", label: "Joint limit set by", get: (a) => limitLabel(a.drive.jointLimitBy) },
  { id: "neck-contact", group: "Drive joint", label: "Neck contact angle", get: (a) => a.drive.neckContactAngleDeg, digits: 1, unit: "°" },
  { id: "clearance", group: "Drive joint", label: "Least neck clearance", get: (a) => a.drive.minNeckClearanceMm, digits: 2, length: true, readout: "neckClearanceMm" },
  { id: "plunge-min", group: "Drive joint", label: "Plunge, least", get: (a) => a.drive.plungeMinMm, digits: 2, length: true, signed: true },
  { id: "plunge-max", group: "Drive joint", label: "Plunge, most", get: (a) => a.drive.plungeMaxMm, digits: 2, length: true, signed: true },
  { id: "cardan", group: "Drive joint", label: "Cardan speed fluctuation", get: (a) => (a.drive.cardan ? a.drive.cardan.fluctuation * 100 : null), digits: 1, unit: "%" },
  { id: "ackermann", group: "Steering axis", label: "Ackermann at lock", get: (a) => a.ackermann.atLockPct, digits: 0, unit: "%", readout: "ackermannPct" },
  { id: "kpi", group: "Steering axis", label: "Kingpin inclination", get: (a) => a.steerAxis.kingpinInclinationDeg, digits: 1, unit: "°" },
  { id: "caster", group: "Steering axis", label: "Caster", get: (a) => a.steerAxis.casterDeg, digits: 1, unit: "°" },
  { id: "scrub", group: "Steering axis", label: "Scrub radius", get: (a) => a.steerAxis.scrubRadiusMm, digits: 1, length: true, signed: true },
  { id: "trail", group: "Steering axis", label: "Caster trail", get: (a) => a.steerAxis.casterTrailMm, digits: 1, length: true, signed: true },
  { id: "camber", group: "Suspension", label: "Camber at ride height", get: (a) => a.atStatic.camberDeg, digits: 2, unit: "°", signed: true },
  { id: "camber-bump", group: "Suspension", label: "Camber at full bump", get: (a) => a.travel[a.travel.length - 1]!.camberDeg, digits: 2, unit: "°", signed: true },
  { id: "camber-droop", group: "Suspension", label: "Camber at full droop", get: (a) => a.travel[0]!.camberDeg, digits: 2, unit: "°", signed: true },
  { id: "camber-gain", group: "Suspension", label: "Camber gain at ride height (°/mm)", get: (a) => a.atStatic.camberGainDegPerMm, digits: 3, signed: true },
  { id: "roll-centre", group: "Suspension", label: "Roll centre height", get: (a) => a.atStatic.rollCentreHeightMm, digits: 1, length: true },
  { id: "safety", group: "Shaft strength", label: "Safety factor at the neck", get: (a) => a.strength.safetyFactor, digits: 2, readout: "safetyFactor" },
  { id: "torque", group: "Shaft strength", label: "Shaft torque (N·mm)", get: (a) => a.strength.shaftTorqueNmm, digits: 0 },
  { id: "shear", group: "Shaft strength", label: "Shear stress at the neck (MPa)", get: (a) => a.strength.shearStressMpa, digits: 0 },
  { id: "allowable", group: "Shaft strength", label: "Allowable shear (MPa)", get: (a) => a.strength.allowableShearMpa, digits: 0 },
  { id: "min-neck", group: "Shaft strength", label: "Smallest neck meeting the design factor", get: (a) => a.strength.minimumNeckDiameterMm, digits: 2, length: true },
];

function numberText(v: number | null, o: { digits?: number; unit?: string; length?: boolean; signed?: boolean }, unit: LengthUnit): string {
  if (o.length) return formatLength(v, unit, o.digits ?? 2, o.signed);
  return o.signed ? signed(v, o.digits ?? 1, o.unit ?? "") : fmt(v, o.digits ?? 1, o.unit ?? "");
}

/** A difference as shown ("+0.40 mm"), or null when it rounds to nothing at the figure's precision. */
function deltaText(d: number, o: { digits?: number; unit?: string; length?: boolean }, unit: LengthUnit): string | null {
  const digits = o.length ? lengthDigits(unit, o.digits ?? 2) : (o.digits ?? 1);
  if (Number((o.length ? mmToUnit(d, unit) : d).toFixed(digits)) === 0) return null;
  return o.length ? formatLength(d, unit, o.digits ?? 2, true) : signed(d, o.digits ?? 1, o.unit ?? "");
}

function rowOf(id: string, group: string, label: string, cells: CompareCell[]): CompareRow {
  return { id, group, label, cells, differs: cells.some((c) => c.change !== null && c.change !== "same") };
}

/** The output rows: figures from each item's analysis, judged with each kit's own targets where a target applies. */
export function outputRows(items: readonly ComparedItem[], unit: LengthUnit): CompareRow[] {
  return OUTPUTS.map((o) => {
    const values = items.map((it) => (it.analysis ? o.get(it.analysis) : null));
    const base = values[0];
    const cells = values.map((v, i): CompareCell => {
      const isNum = typeof v === "number" || v === null;
      const num = typeof v === "number" ? v : null;
      const text = typeof v === "string" ? v : numberText(num, o, unit);
      const verdict = o.readout ? judgeReadout(o.readout, num, items[i]!.targets) : "none";
      if (i === 0) return { text, value: num, change: null, crossed: null, verdict, delta: null };
      if (o.readout && isNum) {
        const b = typeof base === "number" ? base : null;
        const c = compareReadout(o.readout, b, num, items[i]!.targets, items[0]!.targets);
        return { text, value: num, change: c.change, crossed: c.crossed, verdict, delta: b !== null && num !== null && c.change !== "same" ? deltaText(num - b, o, unit) : null };
      }
      if (typeof base === "number" && num !== null) {
        const delta = deltaText(num - base, o, unit);
        return { text, value: num, change: delta ? "changed" : "same", crossed: null, verdict, delta };
      }
      const baseText = typeof base === "string" ? base : numberText(typeof base === "number" ? base : null, o, unit);
      return { text, value: num, change: text === baseText ? "same" : "changed", crossed: null, verdict, delta: null };
    });
    return rowOf(`out-${o.id}`, o.group, o.label, cells);
  });
}

const MATERIAL_NAMES = new Map(MATERIALS.map((m) => [m.id, m.name]));

function inputText(f: FieldDef, v: unknown, unit: LengthUnit): string {
  if (v === undefined || v === null) return f.optional ? `— (${f.optional.absentMeans})` : "—";
  if (typeof v === "boolean") return v ? "yes" : "no";
  if (typeof v === "number") {
    if (f.kind === "length") return formatLength(v, unit, 2);
    if (f.kind === "angle") return fmt(v, 2, "°");
    return `${Number(v.toFixed(4))}${f.unit ? ` ${f.unit}` : ""}`;
  }
  if (Array.isArray(v)) return v.map((x) => Number(Number(x).toFixed(4))).join(" × ");
  if (f.path === "strength.material.id") return MATERIAL_NAMES.get(String(v)) ?? String(v);
  return f.choices?.find((c) => c.value === v)?.label ?? String(v);
}

/** The input rows: every field of the layout document, marked changed where it differs from the first item. */
export function inputRows(items: readonly ComparedItem[], unit: LengthUnit): CompareRow[] {
  const rows: CompareRow[] = [];
  for (const g of FIELD_GROUPS) {
    for (const f of g.fields) {
      const raw = items.map((it) => (it.layout ? getAt(it.layout, f.path) : undefined));
      if (raw.every((v) => v === undefined) && f.when) continue; // a variant none of them uses
      const texts = raw.map((v) => inputText(f, v, unit));
      const cells = texts.map((text, i): CompareCell => {
        const num = typeof raw[i] === "number" ? (raw[i] as number) : null;
        const b = typeof raw[0] === "number" ? (raw[0] as number) : null;
        if (i === 0) return { text, value: num, change: null, crossed: null, verdict: "none", delta: null };
        const same = JSON.stringify(raw[i]) === JSON.stringify(raw[0]);
        const delta = !same && num !== null && b !== null ? deltaText(num - b, { digits: 2, length: f.kind === "length", unit: f.kind === "angle" ? "°" : "" }, unit) : null;
        return { text, value: num, change: same ? "same" : "changed", crossed: null, verdict: "none", delta };
      });
      rows.push(rowOf(`in-${f.path}`, g.title, f.label, cells));
    }
  }
  return rows;
}
