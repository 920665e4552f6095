"use client";
// One shelf item's figures as a form (material, joint kind or shaft), checked against the shelf contract
// before it is sent; the server's field errors land on the same inputs.
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { JOINT_TYPES, SHEAR_RULES } from "@/contracts/layout";
import {
  SHEAR_RULE_LABELS,
  shelfItemCreateBody,
  type JointSpec,
  type MaterialSpec,
  type ShaftSpec,
  type ShelfItem,
  type ShelfKind,
  type ShelfSpec,
} from "@/contracts/shelf";
import type { FieldIssue } from "@/lib/api-client";

type Values = Record<string, string | boolean>;

const JOINT_WORDS: Record<(typeof JOINT_TYPES)[number], string> = {
  dogbone: "Dogbone (pin in cup)",
  cvd: "CVD (double joint)",
  "cv-ball": "CV ball joint",
  "single-cardan": "Single cardan",
  "double-cardan": "Double cardan",
};

function startValues(kind: ShelfKind, item?: ShelfItem): Values {
  const name = item?.name ?? "";
  if (kind === "material") {
    const s = item?.spec as MaterialSpec | undefined;
    return { name, printed: s?.printed ?? false, tensileYieldMpa: s ? String(s.tensileYieldMpa) : "", yieldSource: s?.yieldSource ?? "", shearRule: s?.shearRule ?? "distortion-energy", derate: s ? String(s.derate) : "1", derateSource: s?.derateSource ?? "" };
  }
  if (kind === "joint") {
    const s = item?.spec as JointSpec | undefined;
    return { name, jointType: s?.jointType ?? "dogbone", ratedAngleDeg: s ? String(s.ratedAngleDeg) : "", ratedAngleSource: s?.ratedAngleSource ?? "", plungeMm: s?.plungeMm === null || s === undefined ? "" : String(s.plungeMm), plungeSource: s?.plungeSource ?? "" };
  }
  const s = item?.spec as ShaftSpec | undefined;
  return { name, neckDiameterMm: s ? String(s.neckDiameterMm) : "", boreDiameterMm: s ? String(s.boreDiameterMm) : "0", lengthMm: s ? String(s.lengthMm) : "", materialId: s?.materialId ?? "" };
}

const num = (v: string | boolean) => (typeof v === "string" && v.trim() !== "" && Number.isFinite(Number(v)) ? Number(v) : v === "" ? Number.NaN : (v as unknown as number));

function specOf(kind: ShelfKind, v: Values): unknown {
  if (kind === "material") {
    const printed = v.printed === true;
    return { printed, tensileYieldMpa: num(v.tensileYieldMpa!), yieldSource: String(v.yieldSource), shearRule: v.shearRule, derate: num(v.derate!), derateSource: String(v.derateSource) };
  }
  if (kind === "joint") {
    return { jointType: v.jointType, ratedAngleDeg: num(v.ratedAngleDeg!), ratedAngleSource: String(v.ratedAngleSource), plungeMm: String(v.plungeMm).trim() === "" ? null : num(v.plungeMm!), plungeSource: String(v.plungeSource) };
  }
  return { neckDiameterMm: num(v.neckDiameterMm!), boreDiameterMm: num(v.boreDiameterMm!), lengthMm: num(v.lengthMm!), materialId: v.materialId ? String(v.materialId) : null };
}

export interface ShelfFormResult {
  readonly name: string;
  readonly spec: ShelfSpec;
}

export function ShelfItemForm({ kind, item, materials, busy, serverErrors, submitLabel, onSubmit, onCancel }: {
  kind: ShelfKind;
  item?: ShelfItem;
  materials: readonly ShelfItem[];
  busy: boolean;
  serverErrors: readonly FieldIssue[];
  submitLabel: string;
  onSubmit: (r: ShelfFormResult) => void;
  onCancel: () => void;
}) {
  const base = useId();
  const [values, setValues] = useState<Values>(() => startValues(kind, item));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const set = (k: string) => (e: { target: { value: string } }) => setValues((v) => ({ ...v, [k]: e.target.value }));
  const errorOf = (k: string) => errors[k] ?? serverErrors.find((f) => f.path === `spec.${k}` || (k === "name" && f.path === "name"))?.message;
  const id = (k: string) => `${base}-${k}`;

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const body = { kind, name: String(values.name).trim(), spec: specOf(kind, values) };
    const parsed = shelfItemCreateBody.safeParse(body);
    if (!parsed.success) {
      const next: Record<string, string> = {};
      for (const i of parsed.error.issues) {
        const key = i.path[0] === "spec" ? String(i.path[1]) : String(i.path[0]);
        next[key] ??= i.code === "invalid_type" && i.expected === "number" ? "Enter a number" : i.message.replace(/^spec\./, "");
      }
      setErrors(next);
      return;
    }
    setErrors({});
    onSubmit({ name: parsed.data.name, spec: parsed.data.spec });
  };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-2.5" aria-label={`${item ? "Change" : "New"} ${kind}`}>
      <TextField id={id("name")} label="Name" value={String(values.name)} onChange={set("name")} error={errorOf("name")} maxLength={120} />
      {kind === "material" ? (
        <>
          <label className="flex items-center gap-2 text-sm"><input type="checkbox" checked={values.printed === true} onChange={(e) => setValues((v) => ({ ...v, printed: e.target.checked }))} /> Printed part</label>
          <TextField id={id("tensileYieldMpa")} label={values.printed ? "Across-layer strength (MPa)" : "Tensile yield (MPa)"} inputMode="decimal" value={String(values.tensileYieldMpa)} onChange={set("tensileYieldMpa")} error={errorOf("tensileYieldMpa")} />
          <TextField id={id("yieldSource")} label="Source of that figure" value={String(values.yieldSource)} onChange={set("yieldSource")} error={errorOf("yieldSource")} hint="Datasheet, certificate or book, with edition and page" />
          <SelectField id={id("shearRule")} label="Shear allowable rule" value={String(values.shearRule)} onChange={set("shearRule")}>
            {SHEAR_RULES.map((r) => <option key={r} value={r}>{SHEAR_RULE_LABELS[r]}</option>)}
          </SelectField>
          {/* A metal takes 1 unless a calibration from test runs (or another source) says otherwise. */}
          <TextField id={id("derate")} label={values.printed ? "Across-layer derating (0.01 to 1)" : "Derating (1 unless calibrated)"} inputMode="decimal" value={String(values.derate)} onChange={set("derate")} error={errorOf("derate")} />
          <TextField id={id("derateSource")} label="Source of the derating" value={String(values.derateSource)} onChange={set("derateSource")} error={errorOf("derateSource")} hint={values.printed ? undefined : "Needed only when the derating is below 1"} />
        </>
      ) : kind === "joint" ? (
        <>
          <SelectField id={id("jointType")} label="Joint type" value={String(values.jointType)} onChange={set("jointType")}>
            {JOINT_TYPES.map((t) => <option key={t} value={t}>{JOINT_WORDS[t]}</option>)}
          </SelectField>
          <TextField id={id("ratedAngleDeg")} label="Rated operating angle (°)" inputMode="decimal" value={String(values.ratedAngleDeg)} onChange={set("ratedAngleDeg")} error={errorOf("ratedAngleDeg")} />
          <TextField id={id("ratedAngleSource")} label="Source of the rated angle" value={String(values.ratedAngleSource)} onChange={set("ratedAngleSource")} error={errorOf("ratedAngleSource")} />
          <TextField id={id("plungeMm")} label="Plunge it takes (± mm)" inputMode="decimal" value={String(values.plungeMm)} onChange={set("plungeMm")} error={errorOf("plungeMm")} hint="Leave empty when no figure is known" />
          <TextField id={id("plungeSource")} label="Source of the plunge" value={String(values.plungeSource)} onChange={set("plungeSource")} error={errorOf("plungeSource")} />
        </>
      ) : (
        <>
          <TextField id={id("neckDiameterMm")} label="Neck diameter (mm)" inputMode="decimal" value={String(values.neckDiameterMm)} onChange={set("neckDiameterMm")} error={errorOf("neckDiameterMm")} />
          <TextField id={id("boreDiameterMm")} label="Bore (mm, 0 for solid)" inputMode="decimal" value={String(values.boreDiameterMm)} onChange={set("boreDiameterMm")} error={errorOf("boreDiameterMm")} />
          <TextField id={id("lengthMm")} label="Length between joint centres (mm)" inputMode="decimal" value={String(values.lengthMm)} onChange={set("lengthMm")} error={errorOf("lengthMm")} />
          <SelectField id={id("materialId")} label="Material" value={String(values.materialId)} onChange={set("materialId")} error={errorOf("materialId")}>
            <option value="">None on the shelf</option>
            {materials.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
          </SelectField>
        </>
      )}
      <div className="flex justify-end gap-2">
        <Button type="button" variant="secondary" onClick={onCancel}>Cancel</Button>
        <Button type="submit" busy={busy}>{submitLabel}</Button>
      </div>
    </form>
  );
}
