"use client";
// Every field of the layout, with its unit and range, kept in step with the canvas both ways: a drag or
// an undo refreshes the fields; a field left (blur, Enter, or a choice made) writes the document as one
// undo step when every field is valid. Checks between fields show as the fault on the drawing instead.
import { useEffect, useMemo, useRef } from "react";
import { useForm, type FieldErrors, type Resolver } from "react-hook-form";
import type { Layout } from "@/contracts/layout";
import { setField } from "../commands/edit-commands";
import { FIELD_GROUPS, type FieldDef } from "@/figures/layout-fields";
import { useEditor, useEditorStore } from "../store/editor-context";
import { lengthUnitLabel, type LengthUnit } from "@/figures/length-unit";
import { fieldApplies, fieldRangeText, formKey, formToLayout, gearKey, GEAR_RATIOS, layoutToForm, MAX_GEAR_RATIOS, type FormValues } from "./form-values";

// The drive group first: the neck, the cup and the joint are what a designer changes most.
const GROUP_ORDER = ["drive", "strength", "front", "side", "top"];
const GROUPS = GROUP_ORDER.map((id) => FIELD_GROUPS.find((g) => g.id === id)!);

function unitOf(f: FieldDef, unit: LengthUnit): string {
  if (f.kind === "length") return lengthUnitLabel(unit);
  if (f.kind === "angle") return "°";
  return f.unit ?? "";
}

export function PropertyPanel() {
  const store = useEditorStore();
  const layout = useEditor((s) => s.layout);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const readOnly = useEditor((s) => s.readOnly);
  const fault = useEditor((s) => s.live.fault);
  const ctx = useRef({ unit, layout });
  ctx.current = { unit, layout };
  const lastWritten = useRef<Layout | null>(null);

  const resolver = useMemo<Resolver<FormValues, unknown, Layout>>(
    () => async (values) => {
      const r = formToLayout(values, ctx.current.unit, ctx.current.layout);
      if (r.ok) return { values: r.layout, errors: {} };
      const errors: FieldErrors<FormValues> = {};
      for (const [k, message] of Object.entries(r.errors)) errors[k] = { type: "validate", message };
      return { values: {}, errors };
    },
    [],
  );
  const form = useForm<FormValues, unknown, Layout>({ defaultValues: layoutToForm(layout, unit), resolver, mode: "onSubmit", reValidateMode: "onChange" });
  const values = form.watch();

  // The document changed elsewhere (a drag, undo, another unit): show it.
  useEffect(() => {
    // The layout this form just wrote is already what it shows; any other (drag, undo, reload) refreshes it.
    if (layout !== lastWritten.current) form.reset(layoutToForm(layout, unit));
    lastWritten.current = null;
  }, [layout, unit, form]);

  const write = () => {
    if (readOnly) return;
    void form.handleSubmit((next) => {
      if (JSON.stringify(next) === JSON.stringify(store.getState().layout)) return;
      lastWritten.current = next;
      store.getState().commit(next);
    })();
  };

  const errorOf = (key: string) => form.formState.errors[key]?.message as string | undefined;
  const ratioCount = layout.strength.gearRatios.length;
  const changeRatios = (count: number) => {
    const ratios = layout.strength.gearRatios;
    const next = count > ratios.length ? [...ratios, 1] : ratios.slice(0, count);
    store.getState().commit(setField(layout, GEAR_RATIOS, next));
  };

  const renderField = (f: FieldDef) => {
    if (!fieldApplies(f, values)) return null;
    const key = formKey(f.path);
    const id = `field-${key}`;
    const error = errorOf(key);
    const warning = fault && fault.path === f.path ? fault.message : undefined;
    const u = unitOf(f, unit);
    const hintId = `${id}-hint`;
    const describedBy = [hintId, error || warning ? `${id}-msg` : null].filter(Boolean).join(" ");
    if (f.path === GEAR_RATIOS) {
      return (
        <div key={key} className="col-span-2 flex flex-col gap-1">
          <span className="text-xs font-medium text-ink">{f.label} <span className="font-normal text-ink-muted">({f.hint})</span></span>
          <div className="flex flex-wrap items-end gap-2">
            {Array.from({ length: ratioCount }, (_, i) => {
              const k = gearKey(i);
              return (
                <label key={k} className="flex w-20 flex-col text-xs text-ink">
                  <span>Gear ratio {i + 1}</span>
                  <input {...form.register(k)} id={`field-${k}`} readOnly={readOnly} inputMode="decimal" aria-invalid={!!errorOf(k)} className="rounded border border-ink/25 px-1.5 py-1 text-sm tabular-nums aria-[invalid=true]:border-red-600" onBlur={write} onKeyDown={onKey(k)} />
                </label>
              );
            })}
            {!readOnly ? (
              <span className="flex gap-1">
                <button type="button" className="rounded border border-ink/20 px-2 py-1 text-xs disabled:opacity-60" disabled={ratioCount >= MAX_GEAR_RATIOS} onClick={() => changeRatios(ratioCount + 1)}>Add stage</button>
                <button type="button" className="rounded border border-ink/20 px-2 py-1 text-xs disabled:opacity-60" disabled={ratioCount <= 1} onClick={() => changeRatios(ratioCount - 1)}>Remove stage</button>
              </span>
            ) : null}
          </div>
          {Array.from({ length: ratioCount }, (_, i) => errorOf(gearKey(i))).filter(Boolean).map((m) => <p key={m} className="text-xs text-red-700">{m}</p>)}
        </div>
      );
    }
    const label = (
      <label htmlFor={id} className="text-xs font-medium text-ink">
        {f.label}{u ? <span className="font-normal text-ink-muted"> ({u})</span> : null}
      </label>
    );
    const hint = [f.kind === "choice" || f.kind === "text" || f.kind === "boolean" ? "" : fieldRangeText(f, unit), f.optional ? `empty: ${f.optional.absentMeans}` : "", f.hint ?? ""].filter(Boolean).join(" · ");
    const message = error ? <p id={`${id}-msg`} className="text-xs text-red-700">{error}</p> : warning ? <p id={`${id}-msg`} className="text-xs font-medium text-amber-800">{warning}</p> : null;
    if (f.kind === "boolean") {
      return (
        <div key={key} className="flex flex-col gap-0.5">
          <label className="flex items-center gap-2 text-xs font-medium text-ink">
            <input type="checkbox" {...form.register(key)} id={id} disabled={readOnly} onChange={(e) => { void form.register(key).onChange(e); write(); }} />
            {f.label}
          </label>
          {message}
        </div>
      );
    }
    if (f.kind === "choice") {
      return (
        <div key={key} className="flex flex-col gap-0.5">
          {label}
          <select {...form.register(key)} id={id} disabled={readOnly} aria-describedby={describedBy} className="rounded border border-ink/25 bg-white px-1.5 py-1 text-sm" onChange={(e) => { void form.register(key).onChange(e); write(); }}>
            {f.choices!.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
          </select>
          {hint ? <p id={hintId} className="text-[11px] text-ink-muted">{hint}</p> : null}
          {message}
        </div>
      );
    }
    return (
      <div key={key} className={`flex flex-col gap-0.5 ${f.kind === "text" ? "col-span-2" : ""}`}>
        {label}
        <input
          {...form.register(key)}
          id={id}
          readOnly={readOnly}
          inputMode={f.kind === "text" ? undefined : "decimal"}
          autoComplete="off"
          aria-invalid={!!error}
          aria-describedby={describedBy}
          className="rounded border border-ink/25 px-1.5 py-1 text-sm tabular-nums read-only:bg-ink/5 aria-[invalid=true]:border-red-600"
          onBlur={(e) => { void form.register(key).onBlur(e); write(); }}
          onKeyDown={onKey(key)}
        />
        {hint ? <p id={hintId} className="text-[11px] text-ink-muted">{hint}</p> : null}
        {message}
      </div>
    );
  };

  function onKey(key: string) {
    return (e: React.KeyboardEvent<HTMLInputElement>) => {
      if (e.key === "Enter") {
        e.preventDefault();
        write();
      } else if (e.key === "Escape") {
        form.setValue(key, layoutToForm(store.getState().layout, unit)[key] ?? "");
        form.clearErrors(key);
      }
    };
  }

  const orphanFault = fault && fault.path && !GROUPS.some((g) => g.fields.some((f) => f.path === fault.path)) ? fault.message : null;
  return (
    <form aria-label="Layout properties" noValidate onSubmit={(e) => { e.preventDefault(); write(); }} className="flex flex-col gap-3">
      {readOnly ? <p className="rounded bg-ink/5 px-2 py-1 text-xs text-ink">Read only: your role in this workspace can look, not change.</p> : null}
      {orphanFault ? <p className="text-xs font-medium text-amber-800">{orphanFault}</p> : null}
      {GROUPS.map((g) => (
        <fieldset key={g.id} className="rounded-md border border-ink/15 p-2">
          <legend className="px-1 text-xs font-semibold uppercase tracking-wide text-ink/80">{g.title}</legend>
          <div className="grid grid-cols-2 gap-x-3 gap-y-2">{g.fields.map(renderField)}</div>
        </fieldset>
      ))}
    </form>
  );
}
