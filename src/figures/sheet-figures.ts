// What a dimension sheet tabulates, worded and rounded exactly as the editor's readouts: the readout
// groups themselves, plus the strength figures the editor shows beside the safety factor, and the layout's
// inputs as the property panel names them.
import type { Layout } from "@/contracts/layout";
import type { AnalysisResult } from "@/engine";
import { fmt } from "./format";
import { FIELD_GROUPS, type FieldDef } from "./layout-fields";
import { getAt } from "./layout-paths";
import { formatLength, type LengthUnit } from "./length-unit";
import { readoutGroups, type ReadoutGroup } from "./readout-figures";

/** The readout groups with the strength group spelled out: shaft torque, shear stress and its allowable. */
export function sheetFigureGroups(a: AnalysisResult, unit: LengthUnit): ReadoutGroup[] {
  const s = a.strength;
  return readoutGroups(a, unit).map((g) =>
    g.id !== "strength"
      ? g
      : {
          ...g,
          readouts: [
            ...g.readouts,
            { id: "shaft-torque", label: "Shaft torque", value: fmt(s.shaftTorqueNmm, 0, "N·mm"), hint: `motor ${fmt(s.motorTorqueNm, 3, "N·m")} × ${fmt(s.overallRatio, 2)} overall` },
            { id: "shear-stress", label: "Shear stress at the neck", value: fmt(s.shearStressMpa, 0, "MPa") },
            { id: "allowable-shear", label: "Allowable shear", value: fmt(s.allowableShearMpa, 0, "MPa"), hint: s.allowableBasis === "across-layer-derated" ? "across-layer strength, derated" : "tensile yield / √3" },
          ],
        },
  );
}

export interface InputRow {
  readonly path: string;
  readonly label: string;
  readonly value: string;
}

export interface InputGroup {
  readonly id: string;
  readonly title: string;
  readonly rows: readonly InputRow[];
}

function applies(f: FieldDef, layout: Layout): boolean {
  return !f.when || getAt(layout, f.when.path) === f.when.equals;
}

function inputText(f: FieldDef, raw: unknown, unit: LengthUnit): string {
  if (raw === undefined || raw === null) return f.optional ? `— (${f.optional.absentMeans})` : "—";
  if (Array.isArray(raw)) return raw.map((r) => fmt(Number(r), 3)).join(" × ");
  switch (f.kind) {
    case "length":
      return formatLength(Number(raw), unit, 2);
    case "angle":
      return fmt(Number(raw), 2, "°");
    case "number":
    case "integer":
      return f.unit ? `${String(raw)} ${f.unit}` : String(raw);
    case "boolean":
      return raw === true ? "yes" : "no";
    case "choice":
      return f.choices?.find((c) => c.value === raw)?.label ?? String(raw);
    case "text":
      return String(raw) || "—";
  }
}

/** Every input of the layout that applies to it (a Kv motor's fields, not a torque motor's), as text. */
export function inputGroups(layout: Layout, unit: LengthUnit): InputGroup[] {
  return FIELD_GROUPS.map((g) => ({
    id: g.id,
    title: g.title,
    rows: g.fields.filter((f) => applies(f, layout)).map((f) => ({ path: f.path, label: f.label, value: inputText(f, getAt(layout, f.path), unit) })),
  }));
}
