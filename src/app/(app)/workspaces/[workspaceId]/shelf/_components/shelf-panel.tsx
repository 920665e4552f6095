"use client";
// The workspace shelf: materials, joint kinds and shafts with the source of each figure, and how many kits
// take their figures from each. Changing an item that kits use first lists those kits and asks; only then
// are they changed (each gets a new revision).
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Button, Spinner } from "@/components/ui/button";
import { ModalDialog } from "@/components/ui/modal-dialog";
import { ErrorNotice } from "@/components/ui/notice";
import {
  SHEAR_RULE_LABELS,
  SHELF_KIND_LABELS,
  SHELF_KINDS,
  type JointSpec,
  type MaterialSpec,
  type ShaftSpec,
  type ShelfItem,
  type ShelfKind,
  type ShelfKitUse,
} from "@/contracts/shelf";
import { api, ApiError } from "@/lib/api-client";
import { fmt } from "@/figures/format";
import { queryKeys } from "@/lib/query-keys";
import { ShelfItemForm, type ShelfFormResult } from "./shelf-item-form";

type Editing = { kind: ShelfKind; item?: ShelfItem };
type Pending = { item: ShelfItem; change: ShelfFormResult; kits: ShelfKitUse[] };

function Figures({ item, materials }: { item: ShelfItem; materials: ShelfItem[] }) {
  if (item.kind === "material") {
    const s = item.spec as MaterialSpec;
    return (
      <dl className="grid grid-cols-[auto_1fr] gap-x-2 text-xs">
        <dt className="text-ink-muted">{s.printed ? "Across-layer strength" : "Tensile yield"}</dt>
        <dd><span className="font-medium tabular-nums">{fmt(s.tensileYieldMpa, 1, "MPa")}</span> — {s.yieldSource}</dd>
        <dt className="text-ink-muted">Shear rule</dt>
        <dd>{SHEAR_RULE_LABELS[s.shearRule]}</dd>
        {s.printed || s.derate !== 1 ? (
          <>
            <dt className="text-ink-muted">Derating</dt>
            <dd><span className="font-medium tabular-nums">× {s.derate}</span> — {s.derateSource}</dd>
          </>
        ) : null}
      </dl>
    );
  }
  if (item.kind === "joint") {
    const s = item.spec as JointSpec;
    return (
      <dl className="grid grid-cols-[auto_1fr] gap-x-2 text-xs">
        <dt className="text-ink-muted">Rated angle</dt>
        <dd><span className="font-medium tabular-nums">{fmt(s.ratedAngleDeg, 1, "°")}</span> — {s.ratedAngleSource}</dd>
        <dt className="text-ink-muted">Plunge</dt>
        <dd><span className="font-medium tabular-nums">{s.plungeMm === null ? "no figure" : `± ${fmt(s.plungeMm, 1, "mm")}`}</span>{s.plungeSource ? ` — ${s.plungeSource}` : ""}</dd>
      </dl>
    );
  }
  const s = item.spec as ShaftSpec;
  const m = materials.find((x) => x.id === s.materialId);
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-2 text-xs">
      <dt className="text-ink-muted">Neck</dt>
      <dd className="tabular-nums">{fmt(s.neckDiameterMm, 2, "mm")}{s.boreDiameterMm > 0 ? `, bore ${fmt(s.boreDiameterMm, 2, "mm")}` : ", solid"}</dd>
      <dt className="text-ink-muted">Length</dt>
      <dd className="tabular-nums">{fmt(s.lengthMm, 1, "mm")} between joint centres</dd>
      <dt className="text-ink-muted">Material</dt>
      <dd>{m ? m.name : "none on the shelf"}</dd>
    </dl>
  );
}

export function ShelfPanel({ workspaceId, workspaceName, canWrite }: { workspaceId: string; workspaceName: string; canWrite: boolean }) {
  const queryClient = useQueryClient();
  const key = queryKeys.shelf(workspaceId);
  const shelf = useQuery({ queryKey: key, queryFn: ({ signal }) => api<{ items: ShelfItem[] }>(`/api/workspaces/${workspaceId}/shelf`, { signal }).then((r) => r.items) });
  const [editing, setEditing] = useState<Editing | null>(null);
  const [pending, setPending] = useState<Pending | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [deleting, setDeleting] = useState<ShelfItem | null>(null);
  const refresh = () => Promise.all([queryClient.invalidateQueries({ queryKey: key }), queryClient.invalidateQueries({ queryKey: queryKeys.kits(workspaceId) })]);

  const create = useMutation({
    mutationFn: (v: ShelfFormResult & { kind: ShelfKind }) => api<{ item: ShelfItem }>(`/api/workspaces/${workspaceId}/shelf`, { method: "POST", body: v }),
    onSuccess: ({ item }) => {
      setEditing(null);
      setNotice(`Added “${item.name}” to the shelf.`);
      return refresh();
    },
  });
  const change = useMutation({
    mutationFn: (v: { item: ShelfItem; change: ShelfFormResult; kits?: ShelfKitUse[] }) =>
      api<{ item: ShelfItem; changedKits: ShelfKitUse[] }>(`/api/workspaces/${workspaceId}/shelf/${v.item.id}`, {
        method: "PATCH",
        body: { version: v.item.version, name: v.change.name, spec: v.change.spec, ...(v.kits ? { kits: v.kits.map((k) => ({ id: k.id, version: k.version })) } : {}) },
      }),
    onSuccess: (r) => {
      setEditing(null);
      setPending(null);
      setNotice(r.changedKits.length ? `Changed “${r.item.name}” and ${r.changedKits.length} kit${r.changedKits.length === 1 ? "" : "s"} that use it (a new revision each).` : `Changed “${r.item.name}”.`);
      return refresh();
    },
    onError: (error, v) => {
      // The server lists the kits the change would rewrite: ask before any of them changes.
      if (error instanceof ApiError && error.code === "confirm_kits") {
        setEditing(null);
        setPending({ item: v.item, change: v.change, kits: (error.body.kits ?? []) as ShelfKitUse[] });
      }
    },
  });
  const remove = useMutation({
    mutationFn: (item: ShelfItem) => api<void>(`/api/workspaces/${workspaceId}/shelf/${item.id}`, { method: "DELETE" }),
    onSuccess: () => {
      setDeleting(null);
      return refresh();
    },
  });

  const items = shelf.data ?? [];
  const materials = items.filter((i) => i.kind === "material");
  const formError = (editing?.item ? change.error : create.error) as ApiError | null;

  return (
    <div className="flex flex-col gap-4" data-wide>
      <div>
        <h1 className="text-xl font-semibold">Shelf <span className="font-normal text-ink-muted">of {workspaceName}</span></h1>
        <p className="max-w-3xl text-sm text-ink-muted">
          Materials, joint kinds and shafts the workspace designs with, each figure with its source. A layout takes an item&apos;s figures in the editor&apos;s Shelf tab and stays linked to it: changing the item here changes those kits too, after you confirm.
          The shelf started from the engine&apos;s own catalogue; replace its figures with your supplier&apos;s.
        </p>
      </div>
      {notice ? <p role="status" className="rounded-md border border-emerald-300 bg-emerald-50 p-2 text-sm text-emerald-900">{notice}</p> : null}
      {shelf.isPending ? (
        <Spinner label="Loading the shelf…" />
      ) : shelf.isError ? (
        <ErrorNotice title="Could not load the shelf" message={shelf.error.message} onRetry={() => shelf.refetch()} />
      ) : (
        SHELF_KINDS.map((kind) => {
          const ofKind = items.filter((i) => i.kind === kind);
          return (
            <section key={kind} aria-labelledby={`shelf-${kind}`} className="flex flex-col gap-2" data-testid={`shelf-${kind}`}>
              <div className="flex items-center gap-3">
                <h2 id={`shelf-${kind}`} className="text-lg font-semibold">{SHELF_KIND_LABELS[kind].many}</h2>
                {canWrite ? <Button variant="secondary" onClick={() => { create.reset(); setEditing({ kind }); }}>Add a {SHELF_KIND_LABELS[kind].one}</Button> : null}
              </div>
              {ofKind.length === 0 ? (
                <p className="text-sm text-ink-muted">No {SHELF_KIND_LABELS[kind].many.toLowerCase()} on the shelf yet.</p>
              ) : (
                <ul className="divide-y divide-ink/10 rounded-lg border border-ink/10 bg-white">
                  {ofKind.map((item) => (
                    <li key={item.id} className="flex flex-wrap items-start gap-3 px-3 py-2" data-shelf-item={item.id}>
                      <div className="min-w-0 flex-1">
                        <p className="font-medium">{item.name}</p>
                        <Figures item={item} materials={materials} />
                      </div>
                      <div className="flex flex-col items-end gap-1 text-xs text-ink-muted">
                        <span>{item.usedBy === 0 ? "no kit uses it" : `used by ${item.usedBy} kit${item.usedBy === 1 ? "" : "s"}`}</span>
                        {item.catalogueId ? <span>from the engine&apos;s catalogue</span> : null}
                        {canWrite ? (
                          <span className="flex gap-1">
                            <Button variant="ghost" className="px-2 py-0.5 text-xs" onClick={() => { change.reset(); setEditing({ kind, item }); }} aria-label={`Change ${item.name}`}>Change</Button>
                            <Button variant="ghost" className="px-2 py-0.5 text-xs" onClick={() => { remove.reset(); setDeleting(item); }} aria-label={`Remove ${item.name}`}>Remove</Button>
                          </span>
                        ) : null}
                      </div>
                    </li>
                  ))}
                </ul>
              )}
            </section>
          );
        })
      )}
      <ModalDialog open={editing !== null} title={editing ? `${editing.item ? "Change" : "Add"} a ${SHELF_KIND_LABELS[editing.kind].one}` : ""} onClose={() => setEditing(null)} testId="shelf-form-dialog">
        {editing ? (
          <>
            {formError && !(formError instanceof ApiError && formError.code === "confirm_kits") && !formError.fields?.length ? <ErrorNotice title="Not saved" message={formError.message} /> : null}
            <ShelfItemForm
              kind={editing.kind}
              item={editing.item}
              materials={materials}
              busy={create.isPending || change.isPending}
              serverErrors={formError?.fields ?? []}
              submitLabel={editing.item ? "Save the change" : "Add to the shelf"}
              onCancel={() => setEditing(null)}
              onSubmit={(r) => (editing.item ? change.mutate({ item: editing.item, change: r }) : create.mutate({ ...r, kind: editing.kind }))}
            />
          </>
        ) : null}
      </ModalDialog>
      <ModalDialog open={pending !== null} title={pending ? `Change ${pending.kits.length} kit${pending.kits.length === 1 ? "" : "s"} too?` : ""} onClose={() => setPending(null)} testId="shelf-confirm-dialog">
        {pending ? (
          <>
            <p className="text-sm">These kits take their figures from “{pending.item.name}”. Each gets a new revision with the changed figures (their earlier revisions stay):</p>
            <ul className="max-h-60 list-disc overflow-auto pl-5 text-sm" aria-label="Kits this change rewrites">
              {pending.kits.map((k) => (
                <li key={k.id}>
                  <Link className="text-steel underline" href={`/workspaces/${workspaceId}/kits/${k.id}`}>{k.name}</Link>
                  <span className="text-ink-muted"> · now at revision {k.headRevision}{k.archived ? " · archived" : ""}</span>
                </li>
              ))}
            </ul>
            {change.isError && !(change.error instanceof ApiError && change.error.code === "confirm_kits") ? <ErrorNotice title="Nothing was changed" message={change.error.message} /> : null}
            <div className="flex justify-end gap-2">
              <Button variant="secondary" autoFocus onClick={() => setPending(null)}>Cancel</Button>
              <Button busy={change.isPending} onClick={() => change.mutate({ item: pending.item, change: pending.change, kits: pending.kits })}>
                Change the item and {pending.kits.length} kit{pending.kits.length === 1 ? "" : "s"}
              </Button>
            </div>
          </>
        ) : null}
      </ModalDialog>
      <ModalDialog open={deleting !== null} title={deleting ? `Remove “${deleting.name}”?` : ""} onClose={() => setDeleting(null)} testId="shelf-delete-dialog">
        <p className="text-sm">Only an item no kit and no shaft uses can be removed; kits always keep their own copy of the figures.</p>
        {remove.isError ? <ErrorNotice title="Not removed" message={remove.error.message} /> : null}
        <div className="flex justify-end gap-2">
          <Button variant="secondary" autoFocus onClick={() => setDeleting(null)}>Keep</Button>
          <Button variant="danger" busy={remove.isPending} onClick={() => deleting && remove.mutate(deleting)}>Remove</Button>
        </div>
      </ModalDialog>
    </div>
  );
}
