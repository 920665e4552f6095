"use client";
// The question: which figures may move (a range, or some choices), the aims, and what to prefer.
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { PREFERENCE_LABELS, SEARCH_PREFERENCES, SEARCH_SAMPLES_DEFAULT, type SearchPreference, type SearchQuestion } from "@/contracts/design-search";
import { TARGET_KEYS, TARGET_LABELS, type Targets } from "@/contracts/targets";
import type { FieldIssue } from "@/lib/api-client";
import type { FigureOffer } from "./search-panel";

type Row = { on: boolean; min: string; max: string; choices: string[] };

/** Where a range starts: a fifth either side of today's value (coordinates ±10 mm), inside the figure's limits. */
function defaultRange(f: Extract<FigureOffer, { kind: "number" }>): [number, number] {
  const coordinate = /^(steeringArmBall|tieRodInner|outboardJoint)/.test(f.key);
  const span = coordinate ? 10 : Math.max(0.5, Math.abs(f.current) * 0.2);
  const round = (v: number) => Math.round(v * 100) / 100;
  return [round(Math.max(f.limit[0], f.current - span)), round(Math.min(f.limit[1], f.current + span))];
}

const FIRST_ON = new Set(["neckDiameterMm", "cupMouthDiameterMm", "pivotDepthMm", "ratedAngleDeg"]);

export function SearchForm({ figures, aims: initialAims, busy, errors, onStart }: {
  figures: FigureOffer[];
  aims: Targets;
  busy: boolean;
  errors: FieldIssue[];
  onStart: (q: SearchQuestion) => void;
}) {
  const id = useId();
  const [rows, setRows] = useState<Record<string, Row>>(() =>
    Object.fromEntries(
      figures.map((f) => {
        if (f.kind === "number") {
          const [min, max] = defaultRange(f);
          return [f.key, { on: FIRST_ON.has(f.key), min: String(min), max: String(max), choices: [] }];
        }
        return [f.key, { on: false, min: "", max: "", choices: [f.current] }];
      }),
    ),
  );
  const [aims, setAims] = useState<Record<string, string>>(() => Object.fromEntries(TARGET_KEYS.map((k) => [k, String(initialAims[k])])));
  const [prefer, setPrefer] = useState<SearchPreference>("most-lock");
  const [samples, setSamples] = useState(String(SEARCH_SAMPLES_DEFAULT));
  const set = (key: string, patch: Partial<Row>) => setRows((r) => ({ ...r, [key]: { ...r[key]!, ...patch } }));
  const errorAt = (path: string) => errors.find((e) => e.path === path || e.path.startsWith(`${path}.`) || e.path.startsWith(`${path}[`))?.message;

  const moves = figures.filter((f) => rows[f.key]!.on);
  const submit = () => {
    onStart({
      moves: moves.map((f) => (f.kind === "number" ? { key: f.key, min: Number(rows[f.key]!.min), max: Number(rows[f.key]!.max) } : { key: f.key, choices: rows[f.key]!.choices })),
      aims: Object.fromEntries(TARGET_KEYS.map((k) => [k, Number(aims[k])])) as unknown as Targets,
      prefer,
      samples: Number(samples),
    });
  };
  const moveError = (i: number) => errorAt(`moves[${i}]`);

  return (
    <form
      data-testid="search-form"
      className="flex flex-col gap-4 rounded-lg border border-ink/10 bg-white p-4"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-base font-semibold">What may move</legend>
        {errorAt("moves") && !errors.some((e) => e.path.startsWith("moves[")) ? <p className="text-sm text-red-700">{errorAt("moves")}</p> : null}
        <div className="grid gap-x-6 gap-y-2 md:grid-cols-2">
          {figures.map((f) => {
            const row = rows[f.key]!;
            const i = moves.indexOf(f);
            const err = i >= 0 ? moveError(i) : undefined;
            const boxId = `${id}-${f.key}`;
            return (
              <div key={f.key} className="flex flex-col gap-1 rounded border border-ink/10 p-2" data-testid={`move-${f.key}`}>
                <label htmlFor={boxId} className="flex items-center gap-2 text-sm font-medium">
                  <input id={boxId} type="checkbox" checked={row.on} onChange={(e) => set(f.key, { on: e.target.checked })} />
                  {f.label}
                  <span className="font-normal text-ink-muted">now {f.kind === "number" ? `${f.current}${f.unit === "°" ? "°" : ` ${f.unit}`}` : f.current}</span>
                </label>
                {row.on && f.kind === "number" ? (
                  <div className="flex items-center gap-2 text-sm">
                    <label htmlFor={`${boxId}-min`}>from</label>
                    <input id={`${boxId}-min`} inputMode="decimal" className="w-20 rounded border border-ink/20 px-1.5 py-0.5" value={row.min} aria-invalid={!!err} onChange={(e) => set(f.key, { min: e.target.value })} />
                    <label htmlFor={`${boxId}-max`}>to</label>
                    <input id={`${boxId}-max`} inputMode="decimal" className="w-20 rounded border border-ink/20 px-1.5 py-0.5" value={row.max} aria-invalid={!!err} onChange={(e) => set(f.key, { max: e.target.value })} />
                    <span className="text-ink-muted">{f.unit}</span>
                  </div>
                ) : null}
                {row.on && f.kind === "choice" ? (
                  <fieldset className="flex flex-wrap gap-x-3 gap-y-1 text-sm">
                    <legend className="sr-only">{f.label}: the choices to try</legend>
                    {f.options.map((o) => (
                      <label key={o} className="flex items-center gap-1">
                        <input
                          type="checkbox"
                          checked={row.choices.includes(o)}
                          onChange={(e) => set(f.key, { choices: e.target.checked ? [...row.choices, o] : row.choices.filter((c) => c !== o) })}
                        />
                        {o}
                      </label>
                    ))}
                  </fieldset>
                ) : null}
                {err ? <p className="text-xs text-red-700">{err}</p> : null}
              </div>
            );
          })}
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-base font-semibold">Aims</legend>
        <div className="grid grid-cols-2 gap-3 md:grid-cols-3">
          {TARGET_KEYS.map((k) => {
            const err = errorAt(`aims.${k}`);
            return (
              <div key={k} className="flex flex-col gap-1">
                <label htmlFor={`${id}-aim-${k}`} className="text-sm font-medium text-ink/80">
                  {TARGET_LABELS[k].label}
                  {TARGET_LABELS[k].unit ? ` (${TARGET_LABELS[k].unit})` : ""}
                </label>
                <input id={`${id}-aim-${k}`} data-testid={`aim-${k}`} inputMode="decimal" className="rounded border border-ink/20 px-2 py-1 text-sm" value={aims[k]} aria-invalid={!!err} onChange={(e) => setAims((a) => ({ ...a, [k]: e.target.value }))} />
                {err ? <p className="text-xs text-red-700">{err}</p> : null}
              </div>
            );
          })}
        </div>
      </fieldset>

      <div className="flex flex-wrap items-end gap-6">
        <fieldset>
          <legend className="mb-1 text-base font-semibold">Among the layouts that meet the aims, prefer</legend>
          <div className="flex flex-wrap gap-4 text-sm">
            {SEARCH_PREFERENCES.map((p) => (
              <label key={p} className="flex items-center gap-1">
                <input type="radio" name={`${id}-prefer`} value={p} checked={prefer === p} onChange={() => setPrefer(p)} />
                {PREFERENCE_LABELS[p]}
              </label>
            ))}
          </div>
        </fieldset>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-samples`} className="text-sm font-medium text-ink/80">Layouts in the first sample</label>
          <input id={`${id}-samples`} inputMode="numeric" className="w-28 rounded border border-ink/20 px-2 py-1 text-sm" value={samples} aria-invalid={!!errorAt("samples")} onChange={(e) => setSamples(e.target.value)} />
          {errorAt("samples") ? <p className="text-xs text-red-700">{errorAt("samples")}</p> : null}
        </div>
        <Button type="submit" busy={busy} disabled={moves.length === 0} data-testid="start-search">Start the search</Button>
      </div>
      {moves.length === 0 ? <p className="text-sm text-ink-muted">Tick at least one figure that may move.</p> : null}
    </form>
  );
}
