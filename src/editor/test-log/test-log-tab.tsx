"use client";
// The kit's test log beside its editor: what the engine predicted next to what happened ("predicted safety
// factor 1.40 — broke in run 3"), every run with its set-up, outcome and photos, and logging a new one.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Button, Spinner } from "@/components/ui/button";
import { ModalDialog } from "@/components/ui/modal-dialog";
import { ErrorNotice } from "@/components/ui/notice";
import type { RevisionRow } from "@/contracts/revisions";
import type { ShelfItem } from "@/contracts/shelf";
import { formatSafetyFactor, predictionLines, type TestRun } from "@/contracts/test-log";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import { useKitLibrary } from "../library/library-context";
import { useEditor } from "../store/editor-context";
import { RunCard } from "./run-card";
import { RunForm } from "./run-form";

export function TestLogTab() {
  const kit = useEditor((s) => s.kit);
  const layout = useEditor((s) => s.layout);
  const analysis = useEditor((s) => s.live.analysis);
  const lib = useKitLibrary();
  const qc = useQueryClient();
  const runsKey = queryKeys.testRuns(kit.workspaceId, kit.kitId);
  const base = `/api/workspaces/${kit.workspaceId}/kits/${kit.kitId}`;
  const runs = useQuery({ queryKey: runsKey, queryFn: ({ signal }) => api<{ runs: TestRun[] }>(`${base}/test-runs`, { signal }).then((r) => r.runs) });
  const head = kit.headRevision ?? 1;
  const revisions = useQuery({
    queryKey: [...queryKeys.revisions(kit.workspaceId, kit.kitId), head],
    queryFn: ({ signal }) => api<{ revisions: RevisionRow[] }>(`${base}/revisions`, { signal }).then((r) => r.revisions),
  });
  const shelf = useQuery({ queryKey: queryKeys.shelf(kit.workspaceId), queryFn: ({ signal }) => api<{ items: ShelfItem[] }>(`/api/workspaces/${kit.workspaceId}/shelf`, { signal }).then((r) => r.items) });
  const [editing, setEditing] = useState<TestRun | "new" | null>(null);
  const [removing, setRemoving] = useState<TestRun | null>(null);
  const refresh = () => {
    void qc.invalidateQueries({ queryKey: runsKey });
    void qc.invalidateQueries({ queryKey: queryKeys.calibration(kit.workspaceId) });
  };
  const remove = useMutation({
    mutationFn: (run: TestRun) => api(`${base}/test-runs/${run.id}`, { method: "DELETE" }),
    onSuccess: () => {
      setRemoving(null);
      refresh();
    },
  });
  const removePhoto = useMutation({
    mutationFn: ({ run, photoId }: { run: TestRun; photoId: string }) => api(`${base}/test-runs/${run.id}/photos/${photoId}`, { method: "DELETE" }),
    onSuccess: refresh,
  });

  const shown = lib?.viewing?.revision ?? head;
  const canWrite = !!lib?.canWrite;
  const materials = (shelf.data ?? []).filter((i) => i.kind === "material");
  const ready = revisions.isSuccess && shelf.isSuccess;

  return (
    <section aria-label="Test log" className="flex flex-col gap-2" data-testid="test-log">
      <p className="text-xs text-ink-muted">
        Runs on the bench or the track, beside what the engine predicted for each set-up. Per material, the{" "}
        <Link className="text-steel underline" href={`/workspaces/${kit.workspaceId}/calibration`}>calibration</Link> shows how good the predictions were.
      </p>
      {analysis ? (
        <p className="text-sm">
          This layout predicts a safety factor of <strong className="tabular-nums">{formatSafetyFactor(analysis.strength.safetyFactor)}</strong> with its own motor, gearing and material.
        </p>
      ) : null}
      {canWrite ? (
        <div>
          <Button variant="secondary" onClick={() => setEditing("new")} disabled={!ready || materials.length === 0}>Log a test run</Button>
          {shelf.isSuccess && materials.length === 0 ? <p className="mt-1 text-xs text-amber-900">Add a material to the shelf first: a run names the material tested.</p> : null}
        </div>
      ) : null}
      {runs.isPending ? (
        <Spinner label="Loading the test log…" />
      ) : runs.isError ? (
        <ErrorNotice title="Could not load the test log" message={runs.error.message} onRetry={() => runs.refetch()} />
      ) : runs.data.length === 0 ? (
        <p className="rounded border border-dashed border-ink/25 p-3 text-sm text-ink-muted">No test runs logged for this kit yet.{canWrite ? " Log one after the next bench or track session." : ""}</p>
      ) : (
        <>
          <section aria-label="Predictions beside outcomes" className="rounded border border-ink/10 bg-paper/60 p-2">
            <h3 className="text-xs font-semibold uppercase tracking-wide text-ink/80">Predicted and what happened</h3>
            <ul data-testid="prediction-lines" className="mt-1 flex flex-col gap-0.5 text-sm">
              {predictionLines(runs.data).map((line) => <li key={line}>{line[0]!.toUpperCase() + line.slice(1)}</li>)}
            </ul>
          </section>
          <ol className="flex flex-col gap-1.5">
            {runs.data.map((run) => (
              <RunCard
                key={run.id}
                run={run}
                current={run.revision === shown}
                actions={canWrite ? (
                  <>
                    <button type="button" className="text-steel underline" onClick={() => setEditing(run)}>Change</button>
                    <button type="button" className="text-red-800 underline" onClick={() => setRemoving(run)}>Delete</button>
                    {run.photos.map((photo, i) => (
                      <button key={photo.id} type="button" className="text-red-800 underline" disabled={removePhoto.isPending} onClick={() => removePhoto.mutate({ run, photoId: photo.id })}>
                        Remove photo {i + 1}
                      </button>
                    ))}
                  </>
                ) : undefined}
              />
            ))}
          </ol>
          {removePhoto.isError ? <ErrorNotice title="The photo was not removed" message={removePhoto.error.message} /> : null}
        </>
      )}
      {ready && editing ? (
        <RunForm
          open
          onClose={() => setEditing(null)}
          onSaved={refresh}
          workspaceId={kit.workspaceId}
          kitId={kit.kitId}
          layout={layout}
          revisions={revisions.data.map((r) => r.number)}
          revision={shown}
          materials={materials}
          run={editing === "new" ? null : editing}
        />
      ) : null}
      <ModalDialog open={removing !== null} title={removing ? `Delete run ${removing.number}?` : ""} onClose={() => setRemoving(null)} testId="delete-run-dialog">
        {removing ? (
          <div className="flex flex-col gap-3">
            <p className="text-sm">The run and its {removing.photos.length === 1 ? "photo" : `${removing.photos.length} photos`} are removed for everyone. Its number is not used again.</p>
            {remove.isError ? <ErrorNotice title="Not deleted" message={remove.error.message} /> : null}
            <div className="flex justify-end gap-2">
              <Button variant="secondary" onClick={() => setRemoving(null)}>Cancel</Button>
              <Button variant="danger" busy={remove.isPending} onClick={() => remove.mutate(removing)}>Delete the run</Button>
            </div>
          </div>
        ) : null}
      </ModalDialog>
    </section>
  );
}
