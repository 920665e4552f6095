"use client";
// Two to four kits or revisions side by side: a legend naming each item's stroke, the front and top views
// overlaid, the plots overlaid, and every output and input in one table with each difference from the
// first item marked better or worse against the targets (or changed where no target judges it); and the
// dimension sheets of the items to download, one each or all in one PDF.
import Link from "next/link";
import { useId, useMemo, useState } from "react";
import type { Comparison } from "@/contracts/compare";
import type { Change } from "@/contracts/targets";
import { CompareSheets } from "@/editor/compare/compare-sheets";
import { inputRows, outputRows, type CompareCell, type CompareRow } from "@/editor/compare/compare-rows";
import { OverlayPlots } from "@/editor/compare/overlay-plots";
import { ITEM_STYLES, itemLetter, OverlayView, type OverlaySteer } from "@/editor/compare/overlay-view";
import type { LengthUnit } from "@/figures/length-unit";
import { CopyLinkButton } from "./copy-link-button";

const CHANGE_WORDS: Record<Exclude<Change, "same">, { mark: string; word: string; tone: string }> = {
  better: { mark: "▲", word: "better", tone: "bg-emerald-50 text-emerald-900" },
  worse: { mark: "▼", word: "worse", tone: "bg-red-50 text-red-800" },
  changed: { mark: "≠", word: "changed", tone: "bg-amber-50 text-amber-950" },
};

function Swatch({ i }: { i: number }) {
  const s = ITEM_STYLES[i]!;
  return (
    <svg width="36" height="10" aria-hidden className="shrink-0">
      <line x1="1" y1="5" x2="35" y2="5" stroke={s.colour} strokeWidth="3" strokeDasharray={s.dash} strokeLinecap="round" />
    </svg>
  );
}

function Cell({ cell }: { cell: CompareCell }) {
  const c = cell.change && cell.change !== "same" ? CHANGE_WORDS[cell.change] : null;
  return (
    <td data-change={cell.change ?? "base"} data-verdict={cell.verdict} className={`px-2.5 py-1.5 align-top tabular-nums ${c ? c.tone : ""}`}>
      <span className={cell.verdict === "misses" ? "font-medium text-red-700" : cell.verdict === "meets" ? "text-emerald-800" : undefined}>
        {cell.text}
        {cell.verdict === "meets" ? <span aria-hidden> ✓</span> : cell.verdict === "misses" ? <span aria-hidden> ✗</span> : null}
        {cell.verdict !== "none" ? <span className="sr-only">, {cell.verdict === "meets" ? "meets" : "misses"} its target</span> : null}
      </span>
      {c ? (
        <span className="block text-xs">
          <span aria-hidden>{c.mark} </span>
          {c.word}
          {cell.delta ? ` (${cell.delta})` : ""}
          {cell.crossed === "now-meets" ? ": now meets its target" : cell.crossed === "now-misses" ? ": now misses its target" : ""}
        </span>
      ) : null}
    </td>
  );
}

function RowsTable({ caption, rows, labels, onlyDiffering, testId }: { caption: string; rows: CompareRow[]; labels: readonly string[]; onlyDiffering: boolean; testId: string }) {
  const shown = onlyDiffering ? rows.filter((r) => r.differs) : rows;
  let lastGroup = "";
  return (
    <div className="overflow-x-auto rounded-lg border border-ink/10 bg-white">
      <table className="w-full text-sm" data-testid={testId}>
        <caption className="px-3 pt-2 text-left text-sm font-semibold">{caption}{onlyDiffering ? ` — ${shown.length} of ${rows.length} differ` : ""}</caption>
        <thead className="bg-ink/5 text-left text-xs text-ink-muted">
          <tr>
            <th scope="col" className="px-2.5 py-2 font-medium">Figure</th>
            {labels.map((l, i) => (
              <th key={i} scope="col" className="px-2.5 py-2 font-medium">
                <span className="flex items-center gap-1.5"><Swatch i={i} /><span className="text-ink">{itemLetter(i)}</span> {l}</span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-ink/10">
          {shown.length === 0 ? (
            <tr><td colSpan={labels.length + 1} className="px-3 py-3 text-ink-muted">Nothing differs here.</td></tr>
          ) : shown.map((r) => {
            const head = r.group !== lastGroup ? r.group : null;
            lastGroup = r.group;
            return (
              <tr key={r.id} data-row={r.id}>
                <th scope="row" className="px-2.5 py-1.5 text-left align-top font-normal">
                  {head ? <span className="block text-[11px] font-semibold uppercase tracking-wide text-ink-muted">{head}</span> : null}
                  {r.label}
                </th>
                {r.cells.map((c, i) => <Cell key={i} cell={c} />)}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

export function ComparePanel({ workspaceId, comparison, lengthUnit }: { workspaceId: string; comparison: Comparison; lengthUnit: LengthUnit }) {
  const { items } = comparison;
  const [steer, setSteer] = useState<OverlaySteer>("straight");
  const [outputsDiffer, setOutputsDiffer] = useState(false);
  const [inputsDiffer, setInputsDiffer] = useState(true);
  const steerName = useId();
  const labels = useMemo(() => items.map((it) => `${it.kitName}, revision ${it.revision}`), [items]);
  const outputs = useMemo(() => outputRows(items, lengthUnit), [items, lengthUnit]);
  const inputs = useMemo(() => inputRows(items, lengthUnit), [items, lengthUnit]);
  const better = outputs.flatMap((r) => r.cells).filter((c) => c.change === "better").length;
  const worse = outputs.flatMap((r) => r.cells).filter((c) => c.change === "worse").length;

  return (
    <div data-wide className="flex flex-col gap-4" data-testid="compare">
      <div className="flex flex-wrap items-center gap-3">
        <Link href={`/workspaces/${workspaceId}/kits`} className="text-sm text-steel hover:underline">← All kits</Link>
        <h1 className="mr-auto text-xl font-semibold">Comparing {items.length} {items.length === 1 ? "kit" : "kits"}</h1>
        <CopyLinkButton />
      </div>
      <section aria-labelledby="compare-legend" className="rounded-lg border border-ink/10 bg-white p-3">
        <h2 id="compare-legend" className="mb-2 text-sm font-semibold">Legend</h2>
        <ol className="flex flex-col gap-1.5 text-sm" data-testid="compare-legend">
          {items.map((it, i) => (
            <li key={i} className="flex flex-wrap items-center gap-2">
              <Swatch i={i} />
              <span className="font-semibold" style={{ color: ITEM_STYLES[i]!.colour }}>{itemLetter(i)}</span>
              <span className="text-ink-muted">({ITEM_STYLES[i]!.pattern})</span>
              <Link className="font-medium hover:underline" href={`/workspaces/${workspaceId}/kits/${it.kitId}${it.isHead ? "" : `?revision=${it.revision}`}`}>{it.kitName}</Link>
              <span className="text-ink-muted">revision {it.revision}{it.isHead ? " (latest)" : ` (latest is ${it.headRevision})`}{it.scale ? ` · ${it.scale}` : ""}</span>
              {it.problem ? <span className="text-xs text-red-700">— {it.problem}</span> : null}
            </li>
          ))}
        </ol>
        {items.length > 1 ? (
          <p className="mt-2 text-xs text-ink-muted">
            Differences are marked against {itemLetter(0)}, judged by each kit&apos;s targets: {better} figure{better === 1 ? "" : "s"} better, {worse} worse.
          </p>
        ) : null}
      </section>
      <CompareSheets workspaceId={workspaceId} items={items} lengthUnit={lengthUnit} />
      <fieldset className="flex flex-wrap items-center gap-3 text-sm">
        <legend className="sr-only">How the views are posed</legend>
        <span className="font-medium">Views:</span>
        <label className="flex items-center gap-1"><input type="radio" name={steerName} checked={steer === "straight"} onChange={() => setSteer("straight")} /> wheels straight ahead</label>
        <label className="flex items-center gap-1"><input type="radio" name={steerName} checked={steer === "lock"} onChange={() => setSteer("lock")} /> each at its own steer lock</label>
      </fieldset>
      <div className="grid gap-3 lg:grid-cols-2">
        <OverlayView items={items} view="front" steer={steer} labels={labels} />
        <OverlayView items={items} view="top" steer={steer} labels={labels} />
      </div>
      <OverlayPlots items={items} labels={labels} unit={lengthUnit} />
      <section aria-labelledby="compare-figures" className="flex flex-col gap-2">
        <div className="flex flex-wrap items-center gap-3">
          <h2 id="compare-figures" className="mr-auto text-lg font-semibold">Figures side by side</h2>
          <label className="flex items-center gap-1 text-sm"><input type="checkbox" checked={outputsDiffer} onChange={(e) => setOutputsDiffer(e.target.checked)} /> only outputs that differ</label>
          <label className="flex items-center gap-1 text-sm"><input type="checkbox" checked={inputsDiffer} onChange={(e) => setInputsDiffer(e.target.checked)} /> only inputs that differ</label>
        </div>
        <RowsTable caption="Outputs" rows={outputs} labels={labels} onlyDiffering={outputsDiffer} testId="compare-outputs" />
        <RowsTable caption="Inputs" rows={inputs} labels={labels} onlyDiffering={inputsDiffer} testId="compare-inputs" />
      </section>
      <p className="rounded-md border border-amber-300 bg-amber-50 p-2 text-xs text-amber-950">
        Strength figures are estimates: printed parts vary with layer direction, infill, temperature and moisture. This is a design aid for models, not a sign-off for full-size or road vehicles.
      </p>
    </div>
  );
}
