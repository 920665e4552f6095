"use client";
// The workspace shelf from inside the editor: take a material, joint kind or shaft's figures into the
// layout (one undo step), see which items the layout is linked to and whether its figures still match
// them, re-apply or unlink. A linked layout changes when its shelf item is changed (after asking).
import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useId, useState } from "react";
import { Button, Spinner } from "@/components/ui/button";
import { ErrorNotice } from "@/components/ui/notice";
import { applyShelfItem, layoutMatchesShelfItem, SHELF_KIND_LABELS, SHELF_KINDS, unlinkShelfItem, type ShelfItem, type ShelfKind } from "@/contracts/shelf";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import { useEditor, useEditorStore } from "../store/editor-context";

function KindRow({ kind, items, materials }: { kind: ShelfKind; items: ShelfItem[]; materials: ShelfItem[] }) {
  const store = useEditorStore();
  const layout = useEditor((s) => s.layout);
  const readOnly = useEditor((s) => s.readOnly);
  const selectId = useId();
  const linkedId = layout.shelf?.[kind];
  const linked = items.find((i) => i.id === linkedId);
  const [choice, setChoice] = useState(linkedId ?? items[0]?.id ?? "");
  const picked = items.find((i) => i.id === choice);
  const apply = (item: ShelfItem) => store.getState().commit(applyShelfItem(store.getState().layout, item, materials));
  const label = SHELF_KIND_LABELS[kind];

  return (
    <section aria-label={label.many} className="flex flex-col gap-1 rounded border border-ink/10 p-2" data-testid={`shelf-tab-${kind}`}>
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink/80">{label.many}</h3>
      {linkedId ? (
        linked ? (
          <p className="text-xs">
            Linked to <strong>{linked.name}</strong>:{" "}
            {layoutMatchesShelfItem(layout, linked) ? <span className="text-emerald-800">the figures match ✓</span> : <span className="text-amber-900">the layout&apos;s figures differ from the item&apos;s</span>}
          </p>
        ) : (
          <p className="text-xs text-amber-900">Linked to a shelf item that is no longer there.</p>
        )
      ) : (
        <p className="text-xs text-ink-muted">Not linked: the layout carries its own figures.</p>
      )}
      {!readOnly ? (
        <div className="flex flex-wrap items-end gap-1.5">
          <label htmlFor={selectId} className="sr-only">{`Shelf ${label.one} to use`}</label>
          <select id={selectId} value={choice} onChange={(e) => setChoice(e.target.value)} className="min-w-0 flex-1 rounded border border-ink/20 bg-white px-1 py-1 text-xs">
            {items.map((i) => <option key={i.id} value={i.id}>{i.name}</option>)}
          </select>
          <Button variant="secondary" className="px-2 py-1 text-xs" disabled={!picked} onClick={() => picked && apply(picked)} aria-label={`Use this ${label.one}`}>Use</Button>
          {linked && !layoutMatchesShelfItem(layout, linked) ? <Button variant="ghost" className="px-2 py-1 text-xs" onClick={() => apply(linked)}>Re-apply</Button> : null}
          {linkedId ? <Button variant="ghost" className="px-2 py-1 text-xs" onClick={() => store.getState().commit(unlinkShelfItem(store.getState().layout, kind))}>Unlink</Button> : null}
        </div>
      ) : null}
    </section>
  );
}

export function ShelfTab() {
  const workspaceId = useEditor((s) => s.kit.workspaceId);
  const shelf = useQuery({ queryKey: queryKeys.shelf(workspaceId), queryFn: ({ signal }) => api<{ items: ShelfItem[] }>(`/api/workspaces/${workspaceId}/shelf`, { signal }).then((r) => r.items) });
  if (shelf.isPending) return <Spinner label="Loading the shelf…" />;
  if (shelf.isError) return <ErrorNotice title="Could not load the shelf" message={shelf.error.message} onRetry={() => shelf.refetch()} />;
  const materials = shelf.data.filter((i) => i.kind === "material");
  return (
    <div className="flex flex-col gap-2" data-testid="shelf-tab">
      <p className="text-xs text-ink-muted">Take figures from the workspace <Link className="text-steel underline" href={`/workspaces/${workspaceId}/shelf`}>shelf</Link>. A shaft brings its neck, bore and material.</p>
      {SHELF_KINDS.map((k) => <KindRow key={k} kind={k} items={shelf.data.filter((i) => i.kind === k)} materials={materials} />)}
    </div>
  );
}
