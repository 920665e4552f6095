"use client";
// How good were the predictions, per material: the plot of every logged run, the bounds and the factor, the
// runs as a table, and applying the calibrated derate to the shelf material (after confirming the kits it
// rewrites, like any shelf edit).
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Button, Spinner } from "@/components/ui/button";
import { ModalDialog } from "@/components/ui/modal-dialog";
import { EmptyState, ErrorNotice } from "@/components/ui/notice";
import type { MaterialCalibration } from "@/contracts/calibration";
import type { ShelfItem, ShelfKitUse } from "@/contracts/shelf";
import { formatSafetyFactor } from "@/contracts/test-log";
import { OutcomeBadge, formatTestedOn } from "@/editor/test-log/run-card";
import { api, ApiError } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import { CalibrationPlot } from "./calibration-plot";

const STATUS_TEXT = {
  separated: null,
  overlap: "A run that broke was predicted at least as safe as a run that held: no single derate puts the line between them. Look at the set-ups (loads, print settings, batches) of the runs that cross.",
  "one-sided": "Calibrating needs at least one run that held and one that broke.",
} as const;

type Asking = { m: MaterialCalibration; kits: ShelfKitUse[] };

function Figures({ m }: { m: MaterialCalibration }) {
  const c = m.calibration;
  const sf = (v: number | null) => (v === null ? "—" : formatSafetyFactor(v));
  return (
    <dl className="grid grid-cols-2 gap-1.5 text-sm sm:grid-cols-4">
      <div className="rounded border border-ink/10 px-2 py-1"><dt className="text-xs text-ink-muted">Runs</dt><dd className="font-semibold tabular-nums">{c.runs} <span className="text-xs font-normal text-ink-muted">({c.held} held, {c.worn} worn, {c.broke} broke)</span></dd></div>
      <div className="rounded border border-ink/10 px-2 py-1"><dt className="text-xs text-ink-muted">Lowest safety factor that held</dt><dd data-testid="lowest-held" className="font-semibold tabular-nums">{sf(c.lowestHeld)}</dd></div>
      <div className="rounded border border-ink/10 px-2 py-1"><dt className="text-xs text-ink-muted">Highest safety factor that broke</dt><dd data-testid="highest-broke" className="font-semibold tabular-nums">{sf(c.highestBroke)}</dd></div>
      <div className="rounded border border-ink/10 px-2 py-1"><dt className="text-xs text-ink-muted">Factor on the allowable</dt><dd data-testid="factor" className="font-semibold tabular-nums">{c.factor === null ? "—" : `× ${c.factor.toFixed(3)}`}</dd></div>
    </dl>
  );
}

function RunsTable({ m, workspaceId }: { m: MaterialCalibration; workspaceId: string }) {
  return (
    <details className="text-sm">
      <summary className="cursor-pointer text-steel">The {m.points.length} runs</summary>
      <div className="mt-1 overflow-x-auto">
        <table className="w-full text-left text-xs">
          <caption className="sr-only">Runs of {m.material.name}</caption>
          <thead className="text-ink-muted">
            <tr><th className="py-1 pr-2 font-medium">Kit and run</th><th className="pr-2 font-medium">Tested</th><th className="pr-2 font-medium">Part</th><th className="pr-2 font-medium">Outcome</th><th className="pr-2 text-right font-medium">Safety factor now</th><th className="text-right font-medium">When logged</th></tr>
          </thead>
          <tbody>
            {m.points.map((p) => (
              <tr key={p.runId} className="border-t border-ink/10">
                <td className="py-1 pr-2"><Link className="text-steel underline" href={`/workspaces/${workspaceId}/kits/${p.kitId}?revision=${p.revision}`}>{p.kitName}</Link>, run {p.runNumber}</td>
                <td className="pr-2"><time dateTime={p.testedOn}>{formatTestedOn(p.testedOn)}</time></td>
                <td className="pr-2">{p.part}{p.failureLocation ? ` (${p.failureLocation})` : ""}</td>
                <td className="pr-2"><OutcomeBadge outcome={p.outcome} /></td>
                <td className="pr-2 text-right tabular-nums">{formatSafetyFactor(p.safetyFactor)}</td>
                <td className="text-right tabular-nums">{p.loggedSafetyFactor === null ? "—" : formatSafetyFactor(p.loggedSafetyFactor)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}

export function CalibrationPanel({ workspaceId, workspaceName, canApply }: { workspaceId: string; workspaceName: string; canApply: boolean }) {
  const qc = useQueryClient();
  const key = queryKeys.calibration(workspaceId);
  const data = useQuery({ queryKey: key, queryFn: ({ signal }) => api<{ materials: MaterialCalibration[] }>(`/api/workspaces/${workspaceId}/calibration`, { signal }).then((r) => r.materials) });
  const [asking, setAsking] = useState<Asking | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const apply = useMutation({
    mutationFn: ({ m, kits }: { m: MaterialCalibration; kits?: ShelfKitUse[] }) =>
      api<{ item: ShelfItem; changedKits: ShelfKitUse[] }>(`/api/workspaces/${workspaceId}/calibration/${m.material.id}`, {
        method: "POST",
        body: { version: m.material.version, runs: m.calibration.runs, derate: m.proposal!.derateAfter, ...(kits ? { kits: kits.map((k) => ({ id: k.id, version: k.version })) } : {}) },
      }),
    onSuccess: (res, { m }) => {
      setAsking(null);
      const n = res.changedKits.length;
      setNotice(`${m.material.name} now carries the derate ${m.proposal!.derateAfter} (“calibrated from ${m.calibration.runs} test runs”)${n ? `; ${n} kit${n === 1 ? "" : "s"} got a new revision with it` : ""}.`);
      void qc.invalidateQueries({ queryKey: key });
      void qc.invalidateQueries({ queryKey: queryKeys.shelf(workspaceId) });
      void qc.invalidateQueries({ queryKey: queryKeys.kits(workspaceId) });
    },
    onError: (error, { m }) => {
      if (error instanceof ApiError && error.code === "confirm_kits") setAsking({ m, kits: (error.body.kits as ShelfKitUse[]) ?? [] });
      if (error instanceof ApiError && error.code === "calibration_changed") void qc.invalidateQueries({ queryKey: key });
    },
  });

  return (
    <div className="flex flex-col gap-4" data-testid="calibration">
      <div>
        <h1 className="text-2xl font-semibold">Calibration</h1>
        <p className="text-sm text-ink-muted">
          {workspaceName}: for each shelf material, how the safety factors the engine predicted compare with what the logged test runs did, and the derate that
          would put the failure line between the runs that held and the runs that broke (<a href="/methods#calibration" className="font-medium text-ink underline">how the factor is worked out</a>). Runs are logged from a kit&apos;s Test log tab.
        </p>
      </div>
      {notice ? <p role="status" className="rounded-md border border-emerald-300 bg-emerald-50 p-2 text-sm text-emerald-900">{notice}</p> : null}
      {data.isPending ? (
        <Spinner label="Loading the runs…" />
      ) : data.isError ? (
        <ErrorNotice title="Could not load the calibration" message={data.error.message} onRetry={() => data.refetch()} />
      ) : data.data.length === 0 ? (
        <EmptyState title="No test runs logged yet">Log runs from a kit&apos;s Test log tab; each material with runs gets its plot here.</EmptyState>
      ) : (
        data.data.map((m) => {
          const p = m.proposal;
          return (
            <section key={m.material.id} aria-label={m.material.name} data-material={m.material.name} className="flex flex-col gap-2 rounded-lg border border-ink/10 bg-white p-3">
              <h2 className="text-lg font-semibold">{m.material.name}</h2>
              <p className="text-xs text-ink-muted">
                {m.material.printed ? "Printed" : "Metal"}; allowable shear today {m.allowableShearMpa.toFixed(1)} MPa with the derate {m.material.derate}
                {m.material.derateSource ? ` (${m.material.derateSource})` : ""}.
              </p>
              <Figures m={m} />
              <CalibrationPlot m={m} />
              {STATUS_TEXT[m.calibration.status] ? <p className="text-sm text-amber-950">{STATUS_TEXT[m.calibration.status]}</p> : null}
              {p ? (
                <div className="flex flex-wrap items-center gap-2 rounded border border-steel/30 bg-steel/5 p-2 text-sm">
                  <p data-testid="proposal">
                    Derate {p.derateNow} → <strong className="tabular-nums">{p.derateAfter}</strong>: the line at the safety factor {(1 / m.calibration.factor!).toFixed(2)} of today&apos;s figure, midway (on a log scale) between {formatSafetyFactor(m.calibration.lowestHeld!)} and {formatSafetyFactor(m.calibration.highestBroke!)}.
                  </p>
                  {!p.applicable ? <p className="text-amber-950">{p.reason}</p> : null}
                  {canApply && p.applicable ? (
                    <Button variant="secondary" busy={apply.isPending && apply.variables?.m.material.id === m.material.id} onClick={() => apply.mutate({ m })}>
                      Apply to the shelf material
                    </Button>
                  ) : null}
                </div>
              ) : null}
              {apply.isError && apply.variables?.m.material.id === m.material.id && !(apply.error instanceof ApiError && apply.error.code === "confirm_kits") ? (
                <ErrorNotice title="Not applied" message={apply.error.message} />
              ) : null}
              <RunsTable m={m} workspaceId={workspaceId} />
              <p className="text-xs text-ink-muted">
                A factor is only as good as the runs are like the use to come. Strength figures are estimates: printed parts vary with layer direction, infill, temperature and moisture.
              </p>
            </section>
          );
        })
      )}
      <ModalDialog open={asking !== null} title="Apply the calibration to these kits?" onClose={() => setAsking(null)} testId="calibration-confirm">
        {asking ? (
          <div className="flex flex-col gap-3">
            <p className="text-sm">{asking.m.material.name} is used by {asking.kits.length === 1 ? "this kit" : `these ${asking.kits.length} kits`}; each gets a new revision with the derate {asking.m.proposal?.derateAfter}:</p>
            <ul className="max-h-48 list-disc overflow-y-auto pl-5 text-sm">{asking.kits.map((k) => <li key={k.id}>{k.name}{k.archived ? " (archived)" : ""}</li>)}</ul>
            <div className="flex justify-end gap-2">
              <Button variant="secondary" onClick={() => setAsking(null)}>Cancel</Button>
              <Button busy={apply.isPending} onClick={() => apply.mutate({ m: asking.m, kits: asking.kits })}>Apply and change {asking.kits.length === 1 ? "the kit" : `${asking.kits.length} kits`}</Button>
            </div>
          </div>
        ) : null}
      </ModalDialog>
    </div>
  );
}
