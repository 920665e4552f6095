"use client";
// The library's filters: search, scale, tag, author, time, archive status, verdict against the targets,
// what limits the lock, and ranges of each readout. Every change goes to the URL (and from there to the
// server's query); the search waits for a pause in typing.
import { useEffect, useId, useState } from "react";
import { KIT_SCALES } from "@/contracts/kits";
import { LOCK_LIMITS, type LibraryFacets } from "@/contracts/library";
import { READOUT_KEYS, READOUT_LABELS, type ReadoutKey } from "@/contracts/targets";
import { limitLabel } from "@/figures/format";
import type { LibraryView } from "@/lib/library-url";

const control = "rounded-md border border-ink/20 bg-white px-2 py-1 text-sm focus:border-steel focus:outline-none focus:ring-2 focus:ring-steel/30";

function Labelled({ label, children, id }: { label: string; id: string; children: React.ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-xs font-medium text-ink/80">{label}</label>
      {children}
    </div>
  );
}

function RangeInput({ label, value, onCommit }: { label: string; value: number | undefined; onCommit: (v: number | undefined) => void }) {
  const id = useId();
  // Remounted (by its key) when the URL's value changes, so it starts from it.
  const [text, setText] = useState(value === undefined ? "" : String(value));
  const commit = () => {
    const t = text.trim();
    if (t === "") return onCommit(undefined);
    const n = Number(t);
    if (Number.isFinite(n)) onCommit(n);
    else setText(value === undefined ? "" : String(value));
  };
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-[11px] text-ink-muted">{label}</label>
      <input id={id} inputMode="decimal" value={text} onChange={(e) => setText(e.target.value)} onBlur={commit} onKeyDown={(e) => e.key === "Enter" && commit()} className={`${control} w-20`} />
    </div>
  );
}

export function LibraryFilters({ view, facets, onChange }: { view: LibraryView; facets: LibraryFacets | undefined; onChange: (change: Partial<LibraryView>) => void }) {
  const ids = { q: useId(), scale: useId(), tag: useId(), author: useId(), from: useId(), to: useId(), status: useId(), verdict: useId(), limit: useId() };
  const [q, setQ] = useState(view.q ?? "");
  // The URL changed under the box (back button, Clear filters): show it, unless it is what was typed.
  const [shownQ, setShownQ] = useState(view.q);
  if (view.q !== shownQ) {
    setShownQ(view.q);
    if ((view.q ?? "") !== q.trim()) setQ(view.q ?? "");
  }
  useEffect(() => {
    if ((view.q ?? "") === q.trim()) return;
    const t = setTimeout(() => onChange({ q: q.trim() || undefined }), 300);
    return () => clearTimeout(t);
  }, [q, view.q, onChange]);
  const rangesSet = READOUT_KEYS.some((k) => view[`${k}Min`] !== undefined || view[`${k}Max`] !== undefined);
  const anyFilter = !!(view.q || view.scale?.length || view.tags?.length || view.author || view.updatedFrom || view.updatedTo || view.limitedBy?.length || view.status !== "active" || view.verdict !== "any" || rangesSet);

  return (
    <div role="search" aria-label="Filter the kits" className="flex flex-col gap-2 rounded-lg border border-ink/10 bg-white p-3">
      <div className="flex flex-wrap items-end gap-3">
        <Labelled id={ids.q} label="Search">
          <input id={ids.q} type="search" value={q} placeholder="name, tag or author" onChange={(e) => setQ(e.target.value)} className={`${control} w-52`} data-testid="library-search" />
        </Labelled>
        <Labelled id={ids.scale} label="Scale">
          <select id={ids.scale} value={view.scale?.[0] ?? ""} onChange={(e) => onChange({ scale: e.target.value ? [e.target.value as (typeof KIT_SCALES)[number]] : undefined })} className={control}>
            <option value="">Any scale</option>
            {KIT_SCALES.map((s) => <option key={s} value={s}>{s}</option>)}
          </select>
        </Labelled>
        <Labelled id={ids.tag} label="Tag">
          <select id={ids.tag} value={view.tags?.[0] ?? ""} onChange={(e) => onChange({ tags: e.target.value ? [e.target.value] : undefined })} className={control} data-testid="library-tag">
            <option value="">Any tag</option>
            {(facets?.tags ?? []).map((t) => <option key={t.tag} value={t.tag}>{t.tag} ({t.count})</option>)}
            {view.tags?.[0] && !facets?.tags.some((t) => t.tag === view.tags![0]) ? <option value={view.tags[0]}>{view.tags[0]}</option> : null}
          </select>
        </Labelled>
        <Labelled id={ids.author} label="Author">
          <select id={ids.author} value={view.author ?? ""} onChange={(e) => onChange({ author: e.target.value || undefined })} className={control}>
            <option value="">Anyone</option>
            {(facets?.authors ?? []).map((a) => <option key={a.id} value={a.id}>{a.name} ({a.count})</option>)}
          </select>
        </Labelled>
        <Labelled id={ids.from} label="Updated from">
          <input id={ids.from} type="date" value={view.updatedFrom?.slice(0, 10) ?? ""} onChange={(e) => onChange({ updatedFrom: e.target.value || undefined })} className={control} />
        </Labelled>
        <Labelled id={ids.to} label="Updated to">
          <input id={ids.to} type="date" value={view.updatedTo?.slice(0, 10) ?? ""} onChange={(e) => onChange({ updatedTo: e.target.value || undefined })} className={control} />
        </Labelled>
      </div>
      <div className="flex flex-wrap items-end gap-3">
        <Labelled id={ids.status} label="Showing">
          <select id={ids.status} value={view.status} onChange={(e) => onChange({ status: e.target.value as LibraryView["status"] })} className={control} data-testid="library-status">
            <option value="active">Kits in use</option>
            <option value="archived">Archived kits</option>
            <option value="all">All kits</option>
          </select>
        </Labelled>
        <Labelled id={ids.verdict} label="Against the targets">
          <select id={ids.verdict} value={view.verdict} onChange={(e) => onChange({ verdict: e.target.value as LibraryView["verdict"] })} className={control} data-testid="library-verdict">
            <option value="any">Any</option>
            <option value="meets">Meets every target</option>
            <option value="misses">Misses a target</option>
          </select>
        </Labelled>
        <Labelled id={ids.limit} label="Lock limited by">
          <select id={ids.limit} value={view.limitedBy?.[0] ?? ""} onChange={(e) => onChange({ limitedBy: e.target.value ? [e.target.value as (typeof LOCK_LIMITS)[number]] : undefined })} className={control}>
            <option value="">Anything</option>
            {LOCK_LIMITS.map((l) => <option key={l} value={l}>{limitLabel(l)}</option>)}
          </select>
        </Labelled>
        <details className="relative" open={rangesSet || undefined}>
          <summary className="cursor-pointer rounded-md border border-ink/20 px-2 py-1 text-sm">Readout ranges{rangesSet ? " (set)" : ""}</summary>
          <fieldset className="absolute z-20 mt-1 flex w-[34rem] max-w-[90vw] flex-wrap gap-3 rounded-md border border-ink/20 bg-white p-3 shadow-lg">
            <legend className="sr-only">Readout ranges</legend>
            {READOUT_KEYS.map((k: ReadoutKey) => {
              const { label, unit } = READOUT_LABELS[k];
              const u = unit ? ` (${unit})` : "";
              return (
                <div key={k} className="flex items-end gap-1">
                  <RangeInput key={`${k}-min-${view[`${k}Min`]}`} label={`${label}${u} from`} value={view[`${k}Min`]} onCommit={(v) => onChange({ [`${k}Min`]: v })} />
                  <RangeInput key={`${k}-max-${view[`${k}Max`]}`} label="to" value={view[`${k}Max`]} onCommit={(v) => onChange({ [`${k}Max`]: v })} />
                </div>
              );
            })}
          </fieldset>
        </details>
        {anyFilter ? (
          <button
            type="button"
            className="rounded-md px-2 py-1 text-sm text-steel hover:bg-steel/10"
            onClick={() => {
              setQ("");
              onChange({
                q: undefined, scale: undefined, tags: undefined, author: undefined, updatedFrom: undefined, updatedTo: undefined, limitedBy: undefined, status: "active", verdict: "any",
                ...Object.fromEntries(READOUT_KEYS.flatMap((k) => [[`${k}Min`, undefined], [`${k}Max`, undefined]])),
              });
            }}
          >
            Clear filters
          </button>
        ) : null}
      </div>
    </div>
  );
}
