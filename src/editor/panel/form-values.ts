// The property panel's form values: every layout field as the text the designer sees (lengths in their
// unit), and back to a layout document in mm. Text left as it was shown keeps the stored value exactly,
// so showing a figure rounded (or in inches) never changes it.
import type { Layout } from "@/contracts/layout";
import { layoutFieldsSchema } from "@/contracts/layout";
import { ALL_FIELDS, fieldRange, type FieldDef } from "@/figures/layout-fields";
import { getAt, setAt } from "@/figures/layout-paths";
import { roundMm } from "../commands/edit-commands";
import { lengthUnitLabel, mmToUnit, unitToMm, type LengthUnit } from "@/figures/length-unit";

export type FormValues = Record<string, string | boolean>;
export type FormErrors = Record<string, string>;

/** Form keys are layout paths with "__" for ".", so the form library keeps them flat. */
export const formKey = (path: string) => path.replaceAll(".", "__");
export const pathOfKey = (key: string) => key.replaceAll("__", ".");

export const GEAR_RATIOS = "strength.gearRatios";
export const MAX_GEAR_RATIOS = 6;
export const gearKey = (i: number) => formKey(`${GEAR_RATIOS}.${i}`);

// Values a variant's fields start from when the designer switches to it (a motor given by torque, a
// material of their own). Plain starting points, to be replaced with the designer's figures.
const VARIANT_STARTS: Record<string, number | string | boolean> = {
  "strength.motor.torqueNm": 0.5,
  "strength.motor.kvRpmPerV": 3000,
  "strength.motor.currentA": 60,
  "strength.material.id": "aisi-4140-qt-540",
  "strength.material.name": "",
  "strength.material.yieldMpa": 50,
  "strength.material.printed": true,
  "strength.material.derate": 0.5,
  "strength.material.source": "",
  "strength.material.shearRule": "distortion-energy",
  "drive.slotLimitDeg": 30,
};

function numberText(v: number, f: FieldDef, unit: LengthUnit): string {
  const shown = f.kind === "length" ? mmToUnit(v, unit) : v;
  const digits = f.kind === "length" && unit === "in" ? 5 : 4;
  return String(Number(shown.toFixed(digits)));
}

function isNumberField(f: FieldDef) {
  return f.kind === "length" || f.kind === "angle" || f.kind === "number" || f.kind === "integer";
}

/** The text shown for each field of `layout` (an absent optional number shows empty). */
export function layoutToForm(layout: Layout, unit: LengthUnit): FormValues {
  const values: FormValues = {};
  for (const f of ALL_FIELDS) {
    if (f.path === GEAR_RATIOS) continue;
    const raw = getAt(layout, f.path) ?? VARIANT_STARTS[f.path];
    if (f.kind === "boolean") values[formKey(f.path)] = raw === true;
    else if (isNumberField(f)) values[formKey(f.path)] = typeof raw === "number" ? numberText(raw, f, unit) : "";
    else values[formKey(f.path)] = typeof raw === "string" ? raw : "";
  }
  layout.strength.gearRatios.forEach((r, i) => {
    values[gearKey(i)] = numberText(r, { path: GEAR_RATIOS, label: "", kind: "number" }, unit);
  });
  return values;
}

/** Whether a field applies under the current choices (the variants of a union). */
export function fieldApplies(f: FieldDef, values: FormValues): boolean {
  if (!f.when) return true;
  const v = values[formKey(f.when.path)];
  return v === f.when.equals;
}

function parseNumber(text: string): number | null {
  const t = text.trim().replace(/^(-?\d*),(\d+)$/, "$1.$2");
  if (t === "" || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

function rangeText(path: string, f: FieldDef, unit: LengthUnit): string {
  const r = fieldRange(path);
  if (!r) return "";
  if (f.kind === "length") return `${Number(mmToUnit(r.min, unit).toFixed(4))} to ${Number(mmToUnit(r.max, unit).toFixed(4))} ${lengthUnitLabel(unit)}`;
  return `${r.min} to ${r.max}${f.kind === "angle" ? "°" : f.unit ? ` ${f.unit}` : ""}`;
}

/** The field's range as the panel shows it beside the input ("0.3 to 100 mm"). */
export function fieldRangeText(f: FieldDef, unit: LengthUnit): string {
  return rangeText(f.path, f, unit);
}

export type FormResult = { ok: true; layout: Layout } | { ok: false; errors: FormErrors };

/**
 * The layout the form describes, checked field by field against the layout contract's ranges (in the
 * user's unit). Checks between fields (a neck wider than the mouth) are not made here: such a layout is
 * shown with its fault on the drawing, as a drag would show it.
 */
export function formToLayout(values: FormValues, unit: LengthUnit, base: Layout): FormResult {
  const shown = layoutToForm(base, unit);
  const errors: FormErrors = {};
  let doc: Record<string, unknown> = { schema: 1, topView: { steeringInput: { kind: "rack" } } };
  const put = (path: string, v: unknown) => {
    doc = setAt(doc, path, v);
  };

  const readNumber = (key: string, path: string, f: FieldDef): number | undefined => {
    const text = String(values[key] ?? "");
    if (text === shown[key] && typeof getAt(base, path) === "number") return getAt(base, path) as number;
    if (text.trim() === "") {
      if (!f.optional) errors[key] = `${f.label} is required`;
      return undefined;
    }
    const n = parseNumber(text);
    if (n === null) {
      errors[key] = `${f.label} must be a number`;
      return undefined;
    }
    if (f.kind === "integer" && !Number.isInteger(n)) {
      errors[key] = `${f.label} must be a whole number`;
      return undefined;
    }
    const mm = f.kind === "length" ? roundMm(unitToMm(n, unit)) : n;
    const rangePath = path.startsWith(`${GEAR_RATIOS}.`) ? GEAR_RATIOS : path;
    const r = fieldRange(rangePath);
    if (r && (mm < r.min - 1e-9 || mm > r.max + 1e-9)) {
      errors[key] = `${f.label} must be from ${rangeText(rangePath, f, unit)}`;
      return undefined;
    }
    return mm;
  };

  for (const f of ALL_FIELDS) {
    if (f.path === GEAR_RATIOS || !fieldApplies(f, values)) continue;
    const key = formKey(f.path);
    if (f.kind === "boolean") put(f.path, values[key] === true);
    else if (f.kind === "choice" || f.kind === "text") {
      const text = String(values[key] ?? "").trim();
      if (!text) errors[key] = `${f.label} is required`;
      else put(f.path, text);
    } else put(f.path, readNumber(key, f.path, f));
  }
  const ratioDef = ALL_FIELDS.find((f) => f.path === GEAR_RATIOS)!;
  const ratios: number[] = [];
  for (let i = 0; i < MAX_GEAR_RATIOS; i++) {
    const key = gearKey(i);
    if (!(key in values)) break;
    const v = readNumber(key, `${GEAR_RATIOS}.${i}`, { ...ratioDef, label: `Gear ratio ${i + 1}` });
    if (v !== undefined) ratios.push(v);
  }
  put(GEAR_RATIOS, ratios);
  // Not a field of the panel: which shelf items the figures came from carries over as it was.
  if (base.shelf) put("shelf", base.shelf);
  if (Object.keys(errors).length > 0) return { ok: false, errors };

  const parsed = layoutFieldsSchema.safeParse(doc);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = formKey(issue.path.map(String).join("."));
      errors[key in values ? key : formKey(GEAR_RATIOS)] ??= issue.message;
    }
    return { ok: false, errors };
  }
  return { ok: true, layout: parsed.data as Layout };
}
