"use client";
// One material's runs: predicted safety factor (with the material's figure of today, log scale) against what
// happened, the failure line at 1, the lowest factor that held, the highest that broke, and where the
// calibrated derate would put the line.
import { CartesianGrid, Legend, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from "recharts";
import type { MaterialCalibration } from "@/contracts/calibration";
import { OUTCOME_LABELS, TEST_OUTCOMES, type TestOutcome } from "@/contracts/test-log";
import { PlotCard, PlotEmpty } from "@/editor/plots/plot-card";
import { SERIES } from "@/editor/plots/plot-data";

// Each colour is legend text too: 4.5:1 or more on white (green 5.0:1, amber 5.0:1, red 6.5:1).
const OUTCOME_COLOUR: Record<TestOutcome, string> = { held: SERIES.good, worn: "#b45309", broke: SERIES.limit };
const OUTCOME_SHAPE: Record<TestOutcome, "circle" | "diamond" | "cross"> = { held: "circle", worn: "diamond", broke: "cross" };
const OUTCOME_ROW: Record<TestOutcome, number> = { broke: 1, worn: 2, held: 3 };

export function calibrationRows(m: MaterialCalibration, outcome: TestOutcome) {
  return m.points
    .filter((p) => p.outcome === outcome && Number.isFinite(p.safetyFactor) && p.safetyFactor > 0)
    .map((p) => ({ sf: Number(p.safetyFactor.toFixed(3)), row: OUTCOME_ROW[outcome], label: `${p.kitName}, run ${p.runNumber}` }));
}

/** A log-scale domain holding every point, the line at 1 and the calibrated line, with room either side. */
export function calibrationDomain(m: MaterialCalibration): [number, number] {
  const values = [1, ...m.points.map((p) => p.safetyFactor), ...(m.calibration.factor ? [1 / m.calibration.factor] : [])].filter((v) => Number.isFinite(v) && v > 0);
  return [Math.min(...values) / 1.4, Math.max(...values) * 1.4];
}

/** Round ticks on a log axis: 1, 2 and 5 × 10ⁿ inside the domain. */
export function logTicks([lo, hi]: [number, number]): number[] {
  const ticks: number[] = [];
  for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++) {
    for (const m of [1, 2, 5]) {
      const v = Number((m * 10 ** e).toPrecision(3));
      if (v >= lo && v <= hi) ticks.push(v);
    }
  }
  return ticks;
}

export function CalibrationPlot({ m }: { m: MaterialCalibration }) {
  const c = m.calibration;
  const domain = calibrationDomain(m);
  return (
    <PlotCard
      testId="calibration-plot"
      title={`${m.material.name}: predicted safety factor against outcome`}
      description="Each logged run at the safety factor predicted for its set-up with the material's figure of today (log scale). The solid line is failure (safety factor 1); the dashed lines the lowest factor that held and the highest that broke; the calibrated line lies midway between them."
    >
      {(captionId) =>
        m.points.length === 0 ? (
          <PlotEmpty>No runs with a prediction.</PlotEmpty>
        ) : (
          <div className="h-56">
            <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 560, height: 224 }}>
              <ScatterChart margin={{ left: 4, right: 16, top: 16, bottom: 14 }} aria-labelledby={captionId}>
                <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
                <XAxis dataKey="sf" type="number" scale="log" domain={domain} ticks={logTicks(domain)} allowDataOverflow name="predicted safety factor" fontSize={11} tickFormatter={(v: number) => String(v)} label={{ value: "predicted safety factor", position: "insideBottomRight", offset: -2, fontSize: 11, fill: "#5b5f66" }} />
                <YAxis dataKey="row" type="number" domain={[0.5, 3.5]} ticks={[1, 2, 3]} tickFormatter={(v: number) => ["", "broke", "worn", "held"][v] ?? ""} fontSize={11} width={48} />
                <Tooltip formatter={(v) => (typeof v === "number" && v > 3.5 ? v.toFixed(2) : v)} labelFormatter={() => ""} />
                <Legend wrapperStyle={{ fontSize: 11 }} />
                <ReferenceLine x={1} stroke="#1b1f24" strokeWidth={1.5} label={{ value: "SF 1", position: "top", fontSize: 10, fill: "#1b1f24" }} />
                {c.lowestHeld !== null ? <ReferenceLine x={c.lowestHeld} stroke={SERIES.good} strokeDasharray="4 3" /> : null}
                {c.highestBroke !== null ? <ReferenceLine x={c.highestBroke} stroke={SERIES.limit} strokeDasharray="4 3" /> : null}
                {c.factor !== null ? <ReferenceLine x={1 / c.factor} stroke={SERIES.steel} strokeWidth={2} label={{ value: "calibrated", position: "top", fontSize: 10, fill: SERIES.steel }} /> : null}
                {TEST_OUTCOMES.map((o) => (
                  <Scatter key={o} name={OUTCOME_LABELS[o]} data={calibrationRows(m, o)} fill={OUTCOME_COLOUR[o]} stroke={OUTCOME_COLOUR[o]} shape={OUTCOME_SHAPE[o]} isAnimationActive={false} />
                ))}
              </ScatterChart>
            </ResponsiveContainer>
          </div>
        )
      }
    </PlotCard>
  );
}
