"use client";
// Inner against outer road-wheel angle of the linkage (analysis.steering.steps at ride height), beside
// the ideal 100 % Ackermann curve, cot δo − cot δi = w/L (methods entry "ackermann"), and parallel steer (0 %).
import { CartesianGrid, Line, LineChart, ReferenceDot, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { ackermannIdealOuterDeg, type AnalysisResult } from "@/engine";
import { PlotCard, PlotEmpty } from "./plot-card";
import { chartValue, figureText, SERIES } from "./plot-data";
import { SeriesLegend } from "./series-legend";

export interface AckermannPlotProps {
  readonly analysis: AnalysisResult | null;
  readonly stale?: boolean;
}

/** Rows of one turn (the other mirrors it), by inner angle: the linkage, the ideal and parallel steer. */
export function ackermannPlotRows(a: AnalysisResult) {
  const { kingpinTrackMm, wheelbaseMm } = a.ackermann;
  const sg = a.steering.leftTurnInputSign;
  return a.steering.steps
    .filter((s) => s.steerInput * sg >= 0 && Number.isFinite(s.innerDeg) && Number.isFinite(s.outerDeg))
    .map((s) => ({
      inner: chartValue(s.innerDeg),
      outer: chartValue(s.outerDeg),
      ideal: s.innerDeg > 0 ? chartValue(ackermannIdealOuterDeg(s.innerDeg, kingpinTrackMm, wheelbaseMm)) : chartValue(0),
      parallel: chartValue(s.innerDeg),
    }))
    .filter((r) => r.inner !== null)
    .sort((p, q) => (p.inner ?? 0) - (q.inner ?? 0));
}

export function AckermannPlot({ analysis, stale }: AckermannPlotProps) {
  const rows = analysis ? ackermannPlotRows(analysis) : [];
  const lock = analysis?.steerLock.static;
  const pct = analysis?.ackermann.atLockPct;
  return (
    <PlotCard testId="plot-ackermann" title="Ackermann: outer against inner wheel" stale={stale}
      description={analysis
        ? `At ride height, one turn (the other mirrors it). At the steer lock: ${pct === null || pct === undefined ? `blank — the lock is under ${figureText(analysis.ackermann.minReportingAngleDeg, 1)}° of steer, where the percentage is 0/0` : `${figureText(pct, 0)} % Ackermann`} (100 % = the wheel axes meet on the rear axle line, 0 % = parallel).`
        : undefined}>
      {(captionId) =>
        rows.length < 2 ? (
          <PlotEmpty>No steering figures yet: the layout has not been analysed.</PlotEmpty>
        ) : (
          <div>
          <div className="h-56">
            <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 480, height: 240 }}>
              <LineChart data={rows} margin={{ left: 0, right: 12, top: 4, bottom: 4 }} aria-labelledby={captionId}>
                <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
                <XAxis dataKey="inner" type="number" domain={[0, "dataMax"]} unit="°" fontSize={11} label={{ value: "inner wheel", position: "insideBottomRight", offset: -2, fontSize: 10, fill: "#1b1f24" }} />
                <YAxis fontSize={11} unit="°" width={44} label={{ value: "outer wheel", angle: -90, position: "insideLeft", fontSize: 10, fill: "#1b1f24" }} />
                <Tooltip />
                <Line type="monotone" dataKey="outer" name="this linkage" stroke={SERIES.signal} strokeWidth={2} dot={false} isAnimationActive={false} />
                <Line type="monotone" dataKey="ideal" name="100 % Ackermann" stroke={SERIES.steel} strokeDasharray="6 3" dot={false} isAnimationActive={false} />
                <Line type="linear" dataKey="parallel" name="parallel steer (0 %)" stroke={SERIES.slate} strokeDasharray="2 3" dot={false} isAnimationActive={false} />
                {lock && chartValue(lock.innerDeg) !== null && chartValue(lock.outerDeg) !== null ? (
                  <ReferenceDot x={chartValue(lock.innerDeg)!} y={chartValue(lock.outerDeg)!} r={4} fill={SERIES.signal} stroke="#fff"
                    label={{ value: "lock", position: "top", fontSize: 10, fill: SERIES.signal }} />
                ) : null}
              </LineChart>
            </ResponsiveContainer>
          </div>
          <SeriesLegend series={[
            { name: "this linkage", colour: SERIES.signal },
            { name: "100 % Ackermann", colour: SERIES.steel, dash: "6 3" },
            { name: "parallel steer (0 %)", colour: SERIES.slate, dash: "2 3" },
          ]} />
          </div>
        )
      }
    </PlotCard>
  );
}
