"use client";
// The live figures: rendered with the page from the server's analysis, then replaced by the worker's as
// the designer edits. When the layout is impossible the last valid figures stay, marked out of date.
import { useKitTargets } from "../library/library-context";
import { judgeReadoutGroups } from "../library/readout-verdicts";
import { useEditor } from "../store/editor-context";
import { readoutGroups, zeroLockNote } from "@/figures/readout-figures";

export function ReadoutsPanel() {
  const live = useEditor((s) => s.live);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const targets = useKitTargets();
  const a = live.analysis;
  return (
    <section aria-label="Live readouts" data-testid="readouts" data-seq={live.seq} data-quality={live.quality} data-stale={live.stale ? "true" : "false"} className="flex flex-col gap-3">
      {live.fault ? (
        <div role="alert" className="rounded-md border border-red-300 bg-red-50 p-2 text-sm text-red-900">
          <p className="font-semibold">{live.fault.kind === "invalid" ? "A value is out of range" : "This layout cannot work as drawn"}</p>
          <p>{live.fault.message}</p>
          {a ? <p className="mt-1 text-xs">The figures below are from the last layout that worked.</p> : null}
        </div>
      ) : null}
      {!a ? (
        <p className="text-sm text-ink-muted">No figures yet: the layout has not been analysed.</p>
      ) : (
        <div className={live.stale ? "opacity-55" : undefined} aria-busy={live.stale && !live.fault ? true : undefined}>
          {live.stale ? <p className="mb-1 text-xs font-medium text-amber-900">Figures out of date</p> : null}
          {zeroLockNote(a, unit) ? <p className="mb-2 rounded bg-amber-50 p-2 text-xs text-amber-950">{zeroLockNote(a, unit)}</p> : null}
          {(targets ? judgeReadoutGroups(readoutGroups(a, unit), a, targets) : readoutGroups(a, unit)).map((g) => (
            <section key={g.id} aria-label={g.title} className="mb-2">
              <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink/80">{g.title}</h3>
              <dl className="grid grid-cols-2 gap-1.5">
                {g.readouts.map((r) => (
                  <div key={r.id} className="rounded border border-ink/10 bg-white px-2 py-1">
                    <dt className="text-[11px] text-ink-muted">{r.label}</dt>
                    <dd data-testid={r.id} className={`text-base font-semibold tabular-nums ${r.tone === "bad" ? "text-red-700" : r.tone === "good" ? "text-emerald-700" : "text-ink"}`}>{r.value}</dd>
                    {r.hint ? <dd className="text-[11px] leading-tight text-ink-muted">{r.hint}</dd> : null}
                  </div>
                ))}
              </dl>
            </section>
          ))}
          {a.warnings.length ? (
            <ul className="mt-1 list-disc pl-4 text-xs text-amber-950">{a.warnings.map((w) => <li key={w}>{w}</li>)}</ul>
          ) : null}
        </div>
      )}
    </section>
  );
}
