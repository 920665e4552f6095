"use client";
// The kit's own details beside its layout: tags and notes, and the targets it is judged against (the
// workspace's, each overridable for this kit). Saved with the kit's version, like every other write.
import { useMutation } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { JudgedFigure } from "@/components/ui/judged-figure";
import { ErrorNotice } from "@/components/ui/notice";
import type { KitDetail } from "@/contracts/kits";
import { summarizeAnalysis } from "@/contracts/revisions";
import { READOUT_KEYS, READOUT_LABELS, TARGET_KEYS, TARGET_LABELS, targetOverridesSchema, type TargetKey, type TargetOverrides } from "@/contracts/targets";
import { api, ApiError } from "@/lib/api-client";
import { useEditor, useEditorStore } from "../store/editor-context";
import { useKitLibrary } from "./library-context";

const text = (o: TargetOverrides) => Object.fromEntries(TARGET_KEYS.map((k) => [k, o[k] === undefined ? "" : String(o[k])])) as Record<TargetKey, string>;

export function KitDetailsPanel() {
  const store = useEditorStore();
  const kit = useEditor((s) => s.kit);
  const analysis = useEditor((s) => s.live.analysis);
  const lib = useKitLibrary();
  const [tags, setTags] = useState((lib?.tags ?? []).join(", "));
  const [notes, setNotes] = useState(kit.notes);
  const [targets, setTargets] = useState(() => text(lib?.overrides ?? {}));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState(false);
  const editable = !!lib?.canWrite && !lib.viewing;

  const save = useMutation({
    mutationFn: (body: { tags: string[]; notes: string; targets: TargetOverrides }) =>
      api<{ kit: KitDetail }>(`/api/workspaces/${kit.workspaceId}/kits/${kit.kitId}`, { method: "PATCH", body: { version: store.getState().kit.version, ...body } }),
    onSuccess: ({ kit: k }) => {
      // Only the kit's details changed: the layout (and any unsaved edit of it) stays as it is.
      store.setState({ kit: { ...store.getState().kit, version: k.version, notes: k.notes, updatedAt: k.updatedAt, updatedByName: k.updatedByName } });
      lib?.setOverrides(k.targetOverrides);
      lib?.setTags(k.tags);
      setTags(k.tags.join(", "));
      setTargets(text(k.targetOverrides));
      setSaved(true);
    },
    onError: (error) => {
      if (error instanceof ApiError) setErrors(Object.fromEntries(error.fields.map((f) => [f.path, f.message])));
    },
  });

  if (!lib) return null;
  const summary = analysis ? summarizeAnalysis(analysis) : null;

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    setSaved(false);
    const raw = Object.fromEntries(TARGET_KEYS.filter((k) => targets[k].trim() !== "").map((k) => [k, Number(targets[k])]));
    const parsed = targetOverridesSchema.safeParse(raw);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [`targets.${String(i.path[0])}`, i.code === "invalid_type" ? "Enter a number, or leave empty for the workspace's" : i.message])));
      return;
    }
    setErrors({});
    save.mutate({ tags: tags.split(",").map((t) => t.trim()).filter(Boolean), notes, targets: parsed.data });
  };

  return (
    <form onSubmit={submit} noValidate aria-label="Kit details and targets" className="flex flex-col gap-3 text-sm" data-testid="kit-details">
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink/80">This kit</legend>
        <label className="flex flex-col gap-0.5">
          <span className="text-xs font-medium">Tags (comma-separated)</span>
          <input value={tags} readOnly={!editable} onChange={(e) => setTags(e.target.value)} aria-invalid={!!Object.keys(errors).find((k) => k.startsWith("tags"))} className="rounded border border-ink/20 px-2 py-1" placeholder="race, steel, printed" />
        </label>
        {Object.entries(errors).filter(([k]) => k.startsWith("tags")).map(([k, m]) => <p key={k} className="text-xs text-red-700">{m}</p>)}
        <label className="flex flex-col gap-0.5">
          <span className="text-xs font-medium">Notes</span>
          <textarea value={notes} readOnly={!editable} rows={3} onChange={(e) => setNotes(e.target.value)} className="rounded border border-ink/20 px-2 py-1" />
        </label>
      </fieldset>
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink/80">Targets</legend>
        <p className="text-xs text-ink-muted">Empty takes the <Link className="text-steel underline" href={`/workspaces/${kit.workspaceId}/targets`}>workspace&apos;s</Link>; a figure here is this kit&apos;s own.</p>
        <p className="text-xs"><Link className="text-steel underline" data-testid="design-search-link" href={`/workspaces/${kit.workspaceId}/kits/${kit.kitId}/search`}>Design search</Link>: find the layouts that reach these targets.</p>
        <table className="w-full text-xs">
          <thead className="text-left text-ink-muted"><tr><th className="py-1 font-medium">Target</th><th className="py-1 font-medium">Workspace</th><th className="py-1 font-medium">This kit</th></tr></thead>
          <tbody>
            {TARGET_KEYS.map((k) => (
              <tr key={k}>
                <th scope="row" className="py-0.5 text-left font-normal"><label htmlFor={`kit-target-${k}`}>{TARGET_LABELS[k].label}{TARGET_LABELS[k].unit ? ` (${TARGET_LABELS[k].unit})` : ""}</label></th>
                <td className="tabular-nums">{lib.workspaceTargets[k]}</td>
                <td>
                  <input id={`kit-target-${k}`} inputMode="decimal" value={targets[k]} readOnly={!editable} placeholder="—" onChange={(e) => setTargets((t) => ({ ...t, [k]: e.target.value }))}
                    aria-invalid={!!errors[`targets.${k}`]} aria-describedby={errors[`targets.${k}`] ? `kit-target-${k}-error` : undefined} className="w-20 rounded border border-ink/20 px-1.5 py-0.5 aria-[invalid=true]:border-red-600" />
                  {errors[`targets.${k}`] ? <p id={`kit-target-${k}-error`} className="text-red-700">{errors[`targets.${k}`]}</p> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </fieldset>
      {summary ? (
        <section aria-label="Judged against these targets" className="flex flex-col gap-0.5 text-xs">
          <h3 className="font-semibold uppercase tracking-wide text-ink/80">Judged now</h3>
          {READOUT_KEYS.map((k) => (
            <p key={k} className="flex justify-between"><span>{READOUT_LABELS[k].label}</span><JudgedFigure readout={k} value={summary[k]} targets={lib.targets} /></p>
          ))}
        </section>
      ) : null}
      {save.isError && !(save.error instanceof ApiError && save.error.fields.length && save.error.status === 422) ? <ErrorNotice title="Not saved" message={save.error.message} /> : null}
      {saved ? <p role="status" className="text-xs text-emerald-800">Saved.</p> : null}
      {editable ? <div><Button type="submit" busy={save.isPending}>Save details and targets</Button></div> : <p className="text-xs text-ink-muted">{lib.viewing ? "An earlier revision is shown: details change on the latest." : "You can read this kit but not change it."}</p>}
    </form>
  );
}
