"use client";
// The kit's revisions, newest first, each with its note, author, time and cached key readouts: open one
// read-only, compare it with the latest, restore it as the new latest (a new revision; nothing is deleted)
// or make a variant of it.
import { useMutation, useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button, Spinner } from "@/components/ui/button";
import { JudgedFigure } from "@/components/ui/judged-figure";
import { ModalDialog } from "@/components/ui/modal-dialog";
import { ErrorNotice } from "@/components/ui/notice";
import { compareHref } from "@/contracts/compare";
import type { KitDetail } from "@/contracts/kits";
import { REVISION_KIND_LABELS, readoutsOf, type RevisionRow } from "@/contracts/revisions";
import { api } from "@/lib/api-client";
import { limitLabel } from "@/figures/format";
import { queryKeys } from "@/lib/query-keys";
import { loadKitIntoEditor } from "../save/save-actions";
import { selectDirty } from "../store/editor-store";
import { useEditor, useEditorStore } from "../store/editor-context";
import { useKitLibrary } from "./library-context";
import { VariantDialog } from "./variant-dialog";

const when = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** Asks before restoring a revision as the kit's latest (with an optional note), then shows the latest. */
export function RestoreDialog({ revision, onClose }: { revision: { readonly number: number } | null; onClose: () => void }) {
  const store = useEditorStore();
  const router = useRouter();
  const kit = useEditor((s) => s.kit);
  const dirty = useEditor(selectDirty);
  const lib = useKitLibrary();
  const [note, setNote] = useState("");
  const restore = useMutation({
    mutationFn: (n: number) =>
      api<{ kit: KitDetail }>(`/api/workspaces/${kit.workspaceId}/kits/${kit.kitId}/revisions/${n}/restore`, { method: "POST", body: { version: kit.version, ...(note.trim() ? { note: note.trim() } : {}) } }),
    onSuccess: ({ kit: k }) => {
      onClose();
      // Viewing an old revision: go to the latest, which is now the restored one.
      if (lib?.viewing) router.push(`/workspaces/${k.workspaceId}/kits/${k.id}`);
      else loadKitIntoEditor(store, k);
    },
  });
  return (
    <ModalDialog open={revision !== null} title={revision ? `Restore revision ${revision.number}?` : ""} onClose={onClose} testId="restore-dialog">
      {revision ? (
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            restore.mutate(revision.number);
          }}
        >
          <p className="text-sm">
            Its layout becomes the kit&apos;s latest, as revision {(kit.headRevision ?? 0) + 1}. Every revision stays in the history.
            {dirty && !lib?.viewing ? " Your unsaved changes are replaced; Undo brings them back." : ""}
          </p>
          <label className="flex flex-col gap-1 text-sm">
            Note (optional)
            <input value={note} maxLength={500} onChange={(e) => setNote(e.target.value)} className="rounded-md border border-ink/20 px-2 py-1" placeholder={`Back to revision ${revision.number}`} />
          </label>
          {restore.isError ? <ErrorNotice title="Not restored" message={restore.error.message} /> : null}
          <div className="flex justify-end gap-2">
            <Button type="button" variant="secondary" onClick={onClose}>Cancel</Button>
            <Button type="submit" busy={restore.isPending}>Restore as the latest</Button>
          </div>
        </form>
      ) : null}
    </ModalDialog>
  );
}

export function HistoryPanel() {
  const kit = useEditor((s) => s.kit);
  const lib = useKitLibrary();
  const head = kit.headRevision ?? 0;
  const revisions = useQuery({
    queryKey: [...queryKeys.revisions(kit.workspaceId, kit.kitId), head],
    queryFn: ({ signal }) => api<{ revisions: RevisionRow[] }>(`/api/workspaces/${kit.workspaceId}/kits/${kit.kitId}/revisions`, { signal }).then((r) => r.revisions),
  });
  const [restoring, setRestoring] = useState<RevisionRow | null>(null);
  const [variantOf, setVariantOf] = useState<number | null>(null);
  const base = `/workspaces/${kit.workspaceId}/kits/${kit.kitId}`;
  const shown = lib?.viewing?.revision ?? head;

  return (
    <section aria-label="Revisions" className="flex flex-col gap-2" data-testid="history">
      {lib?.origin ? (
        <p className="text-xs text-ink-muted">
          A variant of{" "}
          {lib.origin.kitId ? <Link className="text-steel underline" href={`/workspaces/${kit.workspaceId}/kits/${lib.origin.kitId}?revision=${lib.origin.revision}`}>“{lib.origin.kitName}”, revision {lib.origin.revision}</Link> : `a deleted kit (revision ${lib.origin.revision})`}.
        </p>
      ) : null}
      {lib?.canWrite ? (
        <div><Button variant="secondary" onClick={() => setVariantOf(shown)}>Make a variant of revision {shown}</Button></div>
      ) : null}
      {revisions.isPending ? (
        <Spinner label="Loading the history…" />
      ) : revisions.isError ? (
        <ErrorNotice title="Could not load the history" message={revisions.error.message} onRetry={() => revisions.refetch()} />
      ) : (
        <ol className="flex flex-col gap-1.5">
          {revisions.data.map((r) => {
            const readouts = readoutsOf(r.summary);
            const isHead = r.number === head;
            return (
              <li key={r.number} data-revision={r.number} className={`rounded border px-2 py-1.5 text-xs ${r.number === shown ? "border-steel bg-steel/5" : "border-ink/10"}`}>
                <div className="flex flex-wrap items-baseline gap-x-2">
                  <span className="text-sm font-semibold">Revision {r.number}</span>
                  {isHead ? <span className="rounded bg-steel/10 px-1 text-steel">latest</span> : null}
                  <span className="text-ink-muted">{REVISION_KIND_LABELS[r.kind]}{r.restoredFrom ? ` from revision ${r.restoredFrom}` : ""}</span>
                </div>
                {r.note ? <p className="mt-0.5 whitespace-pre-wrap text-sm">{r.note}</p> : null}
                <p className="text-ink-muted">{r.authorName ?? "someone no longer here"} · <time dateTime={r.createdAt}>{when.format(new Date(r.createdAt))}</time></p>
                {r.summary?.ok && lib ? (
                  <p className="mt-0.5 flex flex-wrap gap-x-3">
                    <span>lock <JudgedFigure readout="lockDeg" value={readouts.lockDeg} targets={lib.targets} /></span>
                    <span>joint <JudgedFigure readout="maxJointAngleDeg" value={readouts.maxJointAngleDeg} targets={lib.targets} /></span>
                    <span>SF <JudgedFigure readout="safetyFactor" value={readouts.safetyFactor} targets={lib.targets} /></span>
                    <span className="text-ink-muted">{limitLabel(r.summary.lockLimitedBy)}</span>
                  </p>
                ) : r.summary && !r.summary.ok ? (
                  <p className="text-amber-900">No figures: {r.summary.reason}</p>
                ) : null}
                <div className="mt-1 flex flex-wrap gap-x-3">
                  {r.number === shown ? <span className="text-ink-muted">shown now</span> : <Link className="text-steel underline" href={isHead ? base : `${base}?revision=${r.number}`}>{isHead ? "Open the latest" : "Open read-only"}</Link>}
                  {!isHead ? <Link className="text-steel underline" href={compareHref(kit.workspaceId, [{ kitId: kit.kitId, revision: r.number }, { kitId: kit.kitId, revision: null }])}>Compare with the latest</Link> : null}
                  {lib?.canWrite && !isHead ? <button type="button" className="text-steel underline" onClick={() => setRestoring(r)}>Restore as the latest</button> : null}
                  {lib?.canWrite ? <button type="button" className="text-steel underline" onClick={() => setVariantOf(r.number)}>Make a variant</button> : null}
                </div>
              </li>
            );
          })}
        </ol>
      )}
      <RestoreDialog revision={restoring} onClose={() => setRestoring(null)} />
      {variantOf !== null ? <VariantDialog open onClose={() => setVariantOf(null)} workspaceId={kit.workspaceId} kitId={kit.kitId} kitName={kit.name} revision={variantOf} /> : null}
    </section>
  );
}
