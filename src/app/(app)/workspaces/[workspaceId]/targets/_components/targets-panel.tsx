"use client";
// The workspace's targets: what every kit is judged against in the editor, the library and comparisons.
// Admins and owners change them (with the version they read); a kit may override any of them.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ErrorNotice } from "@/components/ui/notice";
import { TARGET_KEYS, TARGET_LABELS, targetsSchema, type TargetKey, type Targets } from "@/contracts/targets";
import { api, ApiError } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

type Record_ = { targets: Targets; version: number; updatedByName: string | null; updatedAt: string };

const HINTS: Record<TargetKey, string> = {
  minLockDeg: "Inner-wheel lock, worst over the travel range",
  maxJointAngleDeg: "Drive-joint operating angle inside the lock",
  minSafetyFactor: "Shaft neck in torsion: allowable over working shear",
  ackermannMinPct: "At lock; 100 % = the wheel axes meet on the rear axle line, 0 % = parallel",
  ackermannMaxPct: "",
  minNeckClearanceMm: "Neck to cup mouth inside the lock (a slotted cup is not judged)",
};

const toText = (t: Targets) => Object.fromEntries(TARGET_KEYS.map((k) => [k, String(t[k])])) as Record<TargetKey, string>;

export function TargetsPanel({ workspaceId, workspaceName, initial, canEdit }: { workspaceId: string; workspaceName: string; initial: Record_; canEdit: boolean }) {
  const queryClient = useQueryClient();
  const key = queryKeys.targets(workspaceId);
  const current = useQuery({ queryKey: key, queryFn: ({ signal }) => api<Record_>(`/api/workspaces/${workspaceId}/targets`, { signal }), initialData: initial });
  const [text, setText] = useState(() => toText(initial.targets));
  const [errors, setErrors] = useState<Partial<Record<TargetKey, string>>>({});
  const [saved, setSaved] = useState(false);
  const save = useMutation({
    mutationFn: (targets: Targets) => api<Record_>(`/api/workspaces/${workspaceId}/targets`, { method: "PUT", body: { version: current.data.version, targets } }),
    onSuccess: (r) => {
      queryClient.setQueryData(key, r);
      setText(toText(r.targets));
      setSaved(true);
      return queryClient.invalidateQueries({ queryKey: queryKeys.kits(workspaceId) });
    },
    onError: (error) => {
      if (error instanceof ApiError && error.status === 409) void current.refetch();
      if (error instanceof ApiError) setErrors(Object.fromEntries(error.fields.map((f) => [f.path.replace(/^targets\./, ""), f.message])));
    },
  });

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    setSaved(false);
    const values = Object.fromEntries(TARGET_KEYS.map((k) => [k, text[k].trim() === "" ? Number.NaN : Number(text[k])]));
    const parsed = targetsSchema.safeParse(values);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.code === "invalid_type" ? `${TARGET_LABELS[i.path[0] as TargetKey].label} must be a number` : i.message])));
      return;
    }
    setErrors({});
    save.mutate(parsed.data);
  };

  return (
    <div className="flex max-w-3xl flex-col gap-4">
      <div>
        <h1 className="text-xl font-semibold">Targets <span className="font-normal text-ink-muted">of {workspaceName}</span></h1>
        <p className="text-sm text-ink-muted">
          Every kit&apos;s readouts are judged against these in the editor, the <Link className="text-steel underline" href={`/workspaces/${workspaceId}/kits`}>library</Link> and comparisons. A kit can set its own in the editor&apos;s Kit &amp; targets tab.
          The starting values are plain starting points for a 1:10 car (common practice, not from a published source): set the ones your team designs to.
        </p>
      </div>
      {save.isError && !(save.error instanceof ApiError && save.error.fields.length && save.error.status !== 409) ? <ErrorNotice title="The targets were not saved" message={save.error.message} /> : null}
      {saved ? <p role="status" className="rounded-md border border-emerald-300 bg-emerald-50 p-2 text-sm text-emerald-900">Saved. Kits are judged against the new targets.</p> : null}
      <form onSubmit={submit} noValidate aria-label="Workspace targets" className="grid gap-3 rounded-lg border border-ink/10 bg-white p-4 sm:grid-cols-2">
        {TARGET_KEYS.map((k) => (
          <TextField
            key={k}
            id={`target-${k}`}
            label={`${TARGET_LABELS[k].label}${TARGET_LABELS[k].unit ? ` (${TARGET_LABELS[k].unit})` : ""}`}
            inputMode="decimal"
            value={text[k]}
            readOnly={!canEdit}
            onChange={(e) => setText((t) => ({ ...t, [k]: e.target.value }))}
            error={errors[k]}
            hint={HINTS[k] || undefined}
          />
        ))}
        <div className="flex items-center justify-between gap-2 sm:col-span-2">
          <p className="text-xs text-ink-muted">Version {current.data.version}{current.data.updatedByName ? `, set by ${current.data.updatedByName}` : ""}</p>
          {canEdit ? <Button type="submit" busy={save.isPending}>Save targets</Button> : <p className="text-xs text-ink-muted">Admins and owners change the targets.</p>}
        </div>
      </form>
    </div>
  );
}
