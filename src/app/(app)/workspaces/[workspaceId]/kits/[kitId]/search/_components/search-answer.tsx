"use client";
// A finished search: lock against safety factor for the non-dominated layouts, the current layout marked and
// the aims drawn; the best few with what they change; when the aims cannot all be met, which and by how much.
import Link from "next/link";
import { CartesianGrid, Legend, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from "recharts";
import { changesOf, type SearchCandidate, type SearchView } from "@/contracts/design-search";
import { READOUT_LABELS, TARGET_LABELS, type ReadoutKey } from "@/contracts/targets";
import { PlotCard, PlotEmpty } from "@/editor/plots/plot-card";
import { SERIES } from "@/editor/plots/plot-data";

const point = (c: SearchCandidate) => ({ lock: Number((c.readouts.lockDeg ?? 0).toFixed(2)), sf: Number((c.readouts.safetyFactor ?? 0).toFixed(2)) });

function figure(key: ReadoutKey, v: number | null): string {
  if (v === null || !Number.isFinite(v)) return "—";
  const { unit, digits } = READOUT_LABELS[key];
  return `${v.toFixed(digits)}${unit === "°" || unit === "%" ? unit : unit ? ` ${unit}` : ""}`;
}

export function SearchAnswerView({ search, workspaceId }: { search: SearchView; workspaceId: string }) {
  const answer = search.answer!;
  const aims = search.question.aims;
  const lockLabel = "steer lock, worst over travel (°)";
  return (
    <div className="flex flex-col gap-4" data-testid="search-answer" data-outcome={answer.outcome}>
      {answer.outcome === "met" ? (
        <p role="status" className="rounded border border-green-700/30 bg-green-50 px-3 py-2 text-sm text-green-900">
          {answer.best.length} layout{answer.best.length === 1 ? "" : "s"} shown of those meeting every aim, out of {answer.tried} tried ({answer.valid} could be built).
        </p>
      ) : (
        <div role="status" data-testid="search-failing" className="rounded border border-amber-600/40 bg-amber-50 px-3 py-2 text-sm text-amber-950">
          <p className="font-medium">No layout in this space meets every aim ({answer.tried} tried). The nearest misses:</p>
          <ul className="list-disc pl-5">
            {answer.failing.map((f) => (
              <li key={f.aim}>
                {TARGET_LABELS[f.aim].label} ({aims[f.aim]}{TARGET_LABELS[f.aim].unit === "" ? "" : TARGET_LABELS[f.aim].unit === "mm" ? " mm" : TARGET_LABELS[f.aim].unit}) by {f.shortfall.toFixed(2)}
                {TARGET_LABELS[f.aim].unit === "mm" ? " mm" : TARGET_LABELS[f.aim].unit}
                {f.bestReached !== null ? `; the best any layout reached is ${f.bestReached.toFixed(2)}` : ""}
              </li>
            ))}
          </ul>
          <p>Widen the ranges, let more figures move, or ease the aims; the nearest layouts are below.</p>
        </div>
      )}

      <PlotCard
        testId="search-plot"
        title="Steer lock against safety factor"
        description="Each point is a layout no other beats on both lock and safety factor (among those meeting the other aims, where any do). The square is the current layout; the dashed lines are the aims of lock and safety factor."
      >
        {(captionId) =>
          answer.front.length === 0 ? (
            <PlotEmpty>No layout in the space could be analysed.</PlotEmpty>
          ) : (
            <div className="h-72">
              <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 640, height: 288 }}>
                <ScatterChart margin={{ left: 8, right: 24, top: 16, bottom: 18 }} aria-labelledby={captionId}>
                  <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
                  <XAxis dataKey="lock" type="number" domain={["auto", "auto"]} name="steer lock" unit="°" fontSize={11} label={{ value: lockLabel, position: "insideBottom", offset: -12, fontSize: 11, fill: "#5b5f66" }} />
                  <YAxis dataKey="sf" type="number" domain={["auto", "auto"]} name="safety factor" fontSize={11} width={48} label={{ value: "safety factor", angle: -90, position: "insideLeft", fontSize: 11, fill: "#5b5f66" }} />
                  <Tooltip formatter={(v) => (typeof v === "number" ? v.toFixed(2) : v)} />
                  <Legend verticalAlign="top" wrapperStyle={{ fontSize: 11 }} />
                  <ReferenceLine x={aims.minLockDeg} ifOverflow="extendDomain" stroke={SERIES.limit} strokeDasharray="5 4" label={{ value: `lock ≥ ${aims.minLockDeg}°`, position: "insideTopRight", fontSize: 10, fill: SERIES.limit }} />
                  <ReferenceLine y={aims.minSafetyFactor} ifOverflow="extendDomain" stroke={SERIES.limit} strokeDasharray="5 4" label={{ value: `SF ≥ ${aims.minSafetyFactor}`, position: "insideBottomLeft", fontSize: 10, fill: SERIES.limit }} />
                  <Scatter name="non-dominated layouts" data={answer.front.map(point)} fill={SERIES.steel} line={{ stroke: SERIES.steel, strokeWidth: 1 }} isAnimationActive={false} />
                  <Scatter name="current layout" data={[point(answer.current)]} fill={SERIES.signal} shape="square" isAnimationActive={false} />
                </ScatterChart>
              </ResponsiveContainer>
            </div>
          )
        }
      </PlotCard>

      <section aria-labelledby="search-best-heading" className="flex flex-col gap-2">
        <h2 id="search-best-heading" className="text-lg font-semibold">{answer.outcome === "met" ? "The best layouts" : "The nearest layouts"}</h2>
        <div className="overflow-x-auto rounded-lg border border-ink/10 bg-white">
          <table className="w-full text-sm" data-testid="search-best">
            <thead className="bg-paper text-left text-xs text-ink-muted">
              <tr>
                <th scope="col" className="px-2 py-1.5">#</th>
                {(["lockDeg", "safetyFactor", "maxJointAngleDeg", "ackermannPct", "neckClearanceMm"] as const).map((k) => (
                  <th key={k} scope="col" className="px-2 py-1.5">{READOUT_LABELS[k].label}</th>
                ))}
                <th scope="col" className="px-2 py-1.5">What changes</th>
                <th scope="col" className="px-2 py-1.5"><span className="sr-only">Open</span></th>
              </tr>
            </thead>
            <tbody>
              <tr className="border-t border-ink/10 text-ink-muted">
                <th scope="row" className="px-2 py-1.5 text-left font-normal">now</th>
                {(["lockDeg", "safetyFactor", "maxJointAngleDeg", "ackermannPct", "neckClearanceMm"] as const).map((k) => (
                  <td key={k} className="px-2 py-1.5">{figure(k, answer.current.readouts[k])}</td>
                ))}
                <td className="px-2 py-1.5">the current layout (revision {search.baseRevision})</td>
                <td />
              </tr>
              {answer.best.map((c, i) => {
                const changes = changesOf(answer.current.values, c.values);
                return (
                  <tr key={i} className="border-t border-ink/10" data-testid="search-best-row">
                    <th scope="row" className="px-2 py-1.5 text-left">{i + 1}</th>
                    {(["lockDeg", "safetyFactor", "maxJointAngleDeg", "ackermannPct", "neckClearanceMm"] as const).map((k) => (
                      <td key={k} className="px-2 py-1.5">{figure(k, c.readouts[k])}</td>
                    ))}
                    <td className="px-2 py-1.5">{changes.length === 0 ? "nothing" : changes.map((ch) => `${ch.label} ${ch.from} → ${ch.to}`).join("; ")}</td>
                    <td className="px-2 py-1.5">
                      <Link className="whitespace-nowrap text-steel underline" href={`/workspaces/${workspaceId}/kits/${search.kitId}?search=${search.id}&layout=${i + 1}`} data-testid="open-in-editor">
                        Open in the editor<span className="sr-only"> (layout {i + 1})</span>
                      </Link>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </section>
    </div>
  );
}
