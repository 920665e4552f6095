"use client";
import { useId } from "react";
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { SteerInputResult, SteerLockResult, SteerStepResult, TravelStepResult } from "@/engine";
import { SeriesLegend } from "@/editor/plots/series-legend";

// Series colours are also the legend's text colour: each must reach 4.5:1 on white (steel 7.2:1, signal 5.2:1).
type Series = { key: string; name: string; colour: string; axis?: "right"; dash?: string };
type Row = Record<string, number | null>;

const round = (v: number | null, d = 3) => (v === null ? null : Number(v.toFixed(d)));

/** One line chart of a readout table: x along `xKey` in `xUnit`, a line per series, an optional limit line. */
function ReadoutChart({ title, data, xKey, xUnit, yUnit, rightUnit, series, limit }: {
  title: string;
  data: Row[];
  xKey: string;
  xUnit: string;
  yUnit: string;
  rightUnit?: string;
  series: Series[];
  limit?: number;
}) {
  const captionId = useId();
  return (
    <figure className="rounded-lg border border-ink/10 bg-white p-3">
      <figcaption id={captionId} className="mb-2 text-sm font-medium">{title}</figcaption>
      <div className="h-56">
        <ResponsiveContainer width="100%" height="100%">
          {/* recharts makes the svg a focusable role="application" (arrow keys move the tooltip): name it. */}
          <LineChart data={data} margin={{ left: -10, right: 8 }} aria-labelledby={captionId}>
            <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
            <XAxis dataKey={xKey} type="number" domain={["dataMin", "dataMax"]} unit={xUnit} fontSize={11} />
            <YAxis yAxisId="left" fontSize={11} unit={yUnit} />
            {rightUnit ? <YAxis yAxisId="right" orientation="right" fontSize={11} unit={rightUnit} /> : null}
            <Tooltip />
            {limit !== undefined ? (
              <ReferenceLine yAxisId="left" y={Number(limit.toFixed(2))} stroke="#b91c1c" strokeDasharray="4 3" label={{ value: "limit", fontSize: 10, fill: "#b91c1c" }} />
            ) : null}
            {series.map((s) => (
              <Line key={s.key} yAxisId={s.axis ?? "left"} type="monotone" dataKey={s.key} name={s.name} stroke={s.colour} strokeDasharray={s.dash} dot={false} isAnimationActive={false} />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <SeriesLegend series={[...series.map((s) => ({ name: s.name, colour: s.colour, dash: s.dash })), ...(limit !== undefined ? [{ name: "joint limit", colour: "#b91c1c", dash: "4 3" }] : [])]} />
    </figure>
  );
}

export function TravelChart({ travel }: { travel: readonly TravelStepResult[] }) {
  const data = travel.map((t) => ({ travel: round(t.travelMm, 1), camber: round(t.camberDeg), rc: round(t.rollCentreHeightMm, 2) }));
  return (
    <ReadoutChart title="Camber and roll centre over travel" data={data} xKey="travel" xUnit=" mm" yUnit="°" rightUnit=" mm"
      series={[{ key: "camber", name: "camber (°)", colour: "#3d5a73" }, { key: "rc", name: "roll-centre height (mm)", colour: "#c2410c", axis: "right", dash: "6 3" }]} />
  );
}

export function SteerLockChart({ perTravel }: { perTravel: readonly SteerLockResult[] }) {
  const data = perTravel.map((l) => ({ travel: round(l.travelMm, 1), inner: round(l.innerDeg, 2), outer: round(l.outerDeg, 2) }));
  return (
    <ReadoutChart title="Steer lock over travel" data={data} xKey="travel" xUnit=" mm" yUnit="°"
      series={[{ key: "inner", name: "inner wheel (°)", colour: "#3d5a73" }, { key: "outer", name: "outer wheel (°)", colour: "#c2410c", dash: "6 3" }]} />
  );
}

export function JointAngleChart({ steps, limitDeg, input }: { steps: readonly SteerStepResult[]; limitDeg: number; input: SteerInputResult }) {
  const data = steps.map((s) => ({ input: round(s.steerInput, 2), left: round(s.leftJointAngleDeg, 2), right: round(s.rightJointAngleDeg, 2) }));
  return (
    <ReadoutChart title={`Joint angle over ${input.kind} travel (static)`} data={data} xKey="input" xUnit={input.unit === "mm" ? " mm" : "°"} yUnit="°" limit={limitDeg}
      series={[{ key: "left", name: "left joint (°)", colour: "#3d5a73" }, { key: "right", name: "right joint (°)", colour: "#c2410c", dash: "6 3" }]} />
  );
}
