"use client";
// One logged run: when, which revision, part and material, the set-up as tested, the outcome and where, the
// prediction made for it, notes and photos (each opens full size).
import type { TestOutcome, TestRun } from "@/contracts/test-log";
import { formatSafetyFactor, OUTCOME_LABELS, setupText } from "@/contracts/test-log";

const day = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeZone: "UTC" });
export const formatTestedOn = (d: string) => day.format(new Date(`${d}T00:00:00Z`));

const OUTCOME_STYLE: Record<TestOutcome, string> = {
  held: "border-emerald-700/40 bg-emerald-50 text-emerald-900",
  worn: "border-amber-700/40 bg-amber-50 text-amber-950",
  broke: "border-red-700/40 bg-red-50 text-red-900",
};

export function OutcomeBadge({ outcome }: { outcome: TestOutcome }) {
  return <span data-outcome={outcome} className={`rounded border px-1.5 text-xs font-semibold ${OUTCOME_STYLE[outcome]}`}>{OUTCOME_LABELS[outcome]}</span>;
}

export function RunCard({ run, current, actions }: { run: TestRun; current: boolean; actions?: React.ReactNode }) {
  const p = run.prediction;
  return (
    <li data-run={run.number} className={`rounded border px-2 py-1.5 text-xs ${current ? "border-steel/60" : "border-ink/10"}`}>
      <div className="flex flex-wrap items-baseline gap-x-2">
        <span className="text-sm font-semibold">Run {run.number}</span>
        <OutcomeBadge outcome={run.outcome} />
        <span className="text-ink-muted"><time dateTime={run.testedOn}>{formatTestedOn(run.testedOn)}</time> · revision {run.revision}</span>
      </div>
      <p className="mt-0.5 text-sm">
        {run.part} <span className="text-ink-muted">in {run.materialName}</span>
      </p>
      {run.failureLocation ? <p className="text-sm">{run.outcome === "broke" ? "Broke" : "Wore"} at: {run.failureLocation}</p> : null}
      <p data-testid="run-prediction" className="mt-0.5">
        {p?.ok ? (
          <>Predicted safety factor <strong className="tabular-nums">{formatSafetyFactor(p.safetyFactor)}</strong> <span className="text-ink-muted">(τ {p.shearStressMpa.toFixed(0)} MPa against {p.allowableShearMpa.toFixed(0)} MPa)</span></>
        ) : (
          <span className="text-amber-900">No prediction: {p?.reason ?? "not computed"}</span>
        )}
      </p>
      <p className="text-ink-muted">{setupText(run.setup)}</p>
      {run.notes ? <p className="mt-0.5 whitespace-pre-wrap text-sm">{run.notes}</p> : null}
      {run.photos.length ? (
        <ul className="mt-1 flex flex-wrap gap-1.5" aria-label={`Photos of run ${run.number}`}>
          {run.photos.map((photo) => (
            <li key={photo.id}>
              <a href={photo.url} target="_blank" rel="noreferrer" className="block rounded border border-ink/15 focus-visible:outline-2 focus-visible:outline-steel">
                {/* eslint-disable-next-line @next/next/no-img-element -- a member-only file streamed by our route, not an optimisable asset */}
                <img src={photo.url} alt={`Run ${run.number}: ${photo.caption || photo.fileName}`} loading="lazy" className="h-20 w-28 rounded object-cover" />
              </a>
            </li>
          ))}
        </ul>
      ) : null}
      <p className="mt-0.5 text-ink-muted">Logged by {run.createdByName ?? "someone no longer here"}</p>
      {actions ? <div className="mt-1 flex flex-wrap gap-x-3">{actions}</div> : null}
    </li>
  );
}
