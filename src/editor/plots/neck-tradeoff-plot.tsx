"use client";
// Steer lock and shaft safety factor against neck diameter (the engine's neckTradeoff), the current neck
// and the target safety factor marked. Picking a diameter — a click on the chart, or the buttons under
// it (one tab stop, arrow keys move) — hands it to onPickNeck.
import { useRef, useState, type KeyboardEvent } from "react";
import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { NeckTradeoff, NeckTradeoffSample } from "@/engine";
import { formatLength, type LengthUnit } from "@/figures/length-unit";
import { PlotCard, PlotEmpty } from "./plot-card";
import { chartLength, chartValue, figureText, lengthAxisUnit, SERIES } from "./plot-data";

export interface NeckTradeoffPlotProps {
  readonly tradeoff: NeckTradeoff | null;
  readonly lengthUnit: LengthUnit;
  /** Called with the picked neck diameter, mm (a sample's own value). */
  readonly onPickNeck: (diameterMm: number) => void;
  /** Picking off (a reader without edit rights); the note says why. */
  readonly pickDisabled?: boolean;
  readonly pickDisabledNote?: string;
  readonly stale?: boolean;
  readonly staleNote?: string;
}

const LIMIT_WORDS: Record<string, string> = {
  "neck-contact": "neck meets the cup mouth",
  "slot-limit": "end of the cup's slot",
  "rated-angle": "joint's rated angle",
  linkage: "tie rod cannot follow",
  "rack-travel": "end of rack travel",
};

/** The test id of a sample's pick button: `neck-pick-<mm>` with the diameter in mm as the engine gives it. */
export const neckPickTestId = (mm: number) => `neck-pick-${String(mm)}`;

/** A sample as words, for its button's name and the chart's tooltip. */
export function neckSampleText(s: NeckTradeoffSample, unit: LengthUnit): string {
  const size = formatLength(s.neckDiameterMm, unit);
  if (!s.ok) return `${size}: not possible (${s.part}: ${s.reason})`;
  return `${size}: steer lock ${figureText(s.steerLockDeg, 1)}° (${LIMIT_WORDS[s.limitedBy] ?? s.limitedBy}), safety factor ${figureText(s.safetyFactor, 2)}`;
}

export function tradeoffPlotRows(t: NeckTradeoff, unit: LengthUnit) {
  return t.samples.map((s) => ({
    neck: chartLength(s.neckDiameterMm, unit),
    lock: s.ok ? chartValue(s.steerLockDeg, 2) : null,
    sf: s.ok ? chartValue(s.safetyFactor, 3) : null,
  }));
}

export function NeckTradeoffPlot({ tradeoff, lengthUnit, onPickNeck, pickDisabled = false, pickDisabledNote, stale, staleNote }: NeckTradeoffPlotProps) {
  const u = lengthAxisUnit(lengthUnit);
  const t = tradeoff;
  const current = t ? t.samples[t.currentIndex] : undefined;
  const pick = (index: number) => {
    const s = t?.samples[index];
    if (!pickDisabled && s && s.ok) onPickNeck(s.neckDiameterMm);
  };
  const minNeck = t?.minimumNeckDiameterMm ?? null;
  return (
    <PlotCard testId="plot-neck-tradeoff" title="Neck diameter: steer lock against strength" stale={stale} staleNote={staleNote}
      description="A thinner neck articulates further before it meets the cup mouth, and carries the same torque on a smaller section. Every other dimension held.">
      {(captionId) =>
        !t || t.samples.every((s) => !s.ok) ? (
          <PlotEmpty>{t ? "No neck diameter in the range gives a layout that works." : "Working out the trade-off…"}</PlotEmpty>
        ) : (
          <div>
            <div className="h-64">
              <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 480, height: 256 }}>
                <LineChart data={tradeoffPlotRows(t, lengthUnit)} margin={{ left: 0, right: 8, top: 14, bottom: 4 }} aria-labelledby={captionId}
                  style={{ cursor: pickDisabled ? "default" : "pointer" }}
                  onClick={(state) => {
                    const i = Number(state?.activeTooltipIndex ?? state?.activeIndex);
                    if (Number.isInteger(i)) pick(i);
                  }}>
                  <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
                  <XAxis dataKey="neck" type="number" domain={["dataMin", "dataMax"]} unit={u} fontSize={11} />
                  <YAxis yAxisId="lock" fontSize={11} unit="°" width={44} />
                  <YAxis yAxisId="sf" orientation="right" fontSize={11} width={40} />
                  <Tooltip />
                  <Legend wrapperStyle={{ fontSize: 11 }} />
                  <ReferenceLine yAxisId="sf" y={chartValue(t.targetSafetyFactor, 3) ?? 0} stroke={SERIES.limit} strokeDasharray="4 3"
                    label={{ value: `target ${figureText(t.targetSafetyFactor, 1)}`, position: "insideTopRight", fontSize: 10, fill: SERIES.limit }} />
                  {chartLength(t.currentNeckMm, lengthUnit) !== null ? (
                    <ReferenceLine yAxisId="lock" x={chartLength(t.currentNeckMm, lengthUnit)!} stroke="#111"
                      label={{ value: "now", position: "top", fontSize: 10, fill: "#111" }} />
                  ) : null}
                  {minNeck !== null && minNeck >= t.rangeMm.min && minNeck <= t.rangeMm.max ? (
                    <ReferenceLine yAxisId="lock" x={chartLength(minNeck, lengthUnit) ?? 0} stroke={SERIES.good} strokeDasharray="2 3" />
                  ) : null}
                  <Line yAxisId="lock" type="monotone" dataKey="lock" name="steer lock °" stroke={SERIES.steel} strokeWidth={2} isAnimationActive={false} dot={{ r: 2.5 }} activeDot={{ r: 5 }} />
                  <Line yAxisId="sf" type="monotone" dataKey="sf" name="safety factor" stroke={SERIES.signal} strokeWidth={2} strokeDasharray="6 3" isAnimationActive={false} dot={{ r: 2.5 }} activeDot={{ r: 5 }} />
                </LineChart>
              </ResponsiveContainer>
            </div>
            <p className="mt-1 text-xs text-ink" data-testid="neck-tradeoff-summary">
              {current ? `Now ${neckSampleText(current, lengthUnit)}; target safety factor ${figureText(t.targetSafetyFactor, 1)}.` : null}
              {minNeck !== null ? <span className="text-ink-muted">{` The target is met from ${formatLength(minNeck, lengthUnit)} up (dotted green line).`}</span> : null}
            </p>
            <NeckPicker tradeoff={t} lengthUnit={lengthUnit} disabled={pickDisabled} onPick={pick} />
            {pickDisabled ? <p className="mt-1 rounded bg-ink/5 px-2 py-1 text-xs text-ink">{pickDisabledNote ?? "Picking a neck is off: this layout cannot be changed here."}</p> : null}
          </div>
        )
      }
    </PlotCard>
  );
}

/** One button per sample; one tab stop, arrow keys (and Home, End) move between them, Enter picks. */
function NeckPicker({ tradeoff, lengthUnit, disabled, onPick }: { tradeoff: NeckTradeoff; lengthUnit: LengthUnit; disabled: boolean; onPick: (i: number) => void }) {
  const [focus, setFocus] = useState(tradeoff.currentIndex);
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const n = tradeoff.samples.length;
  const at = Math.min(Math.max(focus, 0), n - 1);
  const onKey = (e: KeyboardEvent<HTMLDivElement>) => {
    const next = e.key === "ArrowRight" || e.key === "ArrowDown" ? at + 1 : e.key === "ArrowLeft" || e.key === "ArrowUp" ? at - 1 : e.key === "Home" ? 0 : e.key === "End" ? n - 1 : null;
    if (next === null) return;
    e.preventDefault();
    const k = Math.min(Math.max(next, 0), n - 1);
    setFocus(k);
    refs.current[k]?.focus();
  };
  return (
    <div role="toolbar" aria-label="Pick a neck diameter" aria-orientation="horizontal" className="mt-2 flex flex-wrap gap-1" onKeyDown={onKey}>
      {tradeoff.samples.map((s, i) => {
        const isCurrent = i === tradeoff.currentIndex;
        return (
          <button key={s.neckDiameterMm} ref={(el) => { refs.current[i] = el; }} type="button" data-testid={neckPickTestId(s.neckDiameterMm)}
            tabIndex={i === at ? 0 : -1} disabled={disabled || !s.ok} aria-current={isCurrent ? "true" : undefined}
            aria-label={`${neckSampleText(s, lengthUnit)}${isCurrent ? " (now)" : ""}`} title={neckSampleText(s, lengthUnit)}
            onFocus={() => setFocus(i)} onClick={() => onPick(i)}
            className={`rounded border px-1.5 py-0.5 text-xs tabular-nums disabled:cursor-not-allowed disabled:text-ink/40 ${
              isCurrent ? "border-ink bg-ink text-white disabled:text-white" : s.ok && s.meetsTarget ? "border-ink/25 bg-white text-ink hover:bg-ink/5" : "border-red-300 bg-red-50 text-red-900 hover:bg-red-100"
            }`}>
            {formatLength(s.neckDiameterMm, lengthUnit).replace(/ (mm|in)$/, "")}
          </button>
        );
      })}
    </div>
  );
}
