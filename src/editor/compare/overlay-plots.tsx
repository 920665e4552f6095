"use client";
// The editor's plots with every compared item on one chart, in the item's own stroke (ITEM_STYLES).
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { ComparedItem } from "@/contracts/compare";
import type { AnalysisResult } from "@/engine";
import { ackermannPlotRows } from "../plots/ackermann-plot";
import { PlotCard, PlotEmpty } from "../plots/plot-card";
import { chartLength, chartValue, lengthAxisUnit } from "../plots/plot-data";
import type { LengthUnit } from "@/figures/length-unit";
import { ITEM_STYLES, itemLetter } from "./overlay-view";

type Point = { x: number | null; y: number | null };
type SeriesOf = (a: AnalysisResult, unit: LengthUnit) => Point[];

interface ChartDef {
  readonly id: string;
  readonly title: string;
  readonly description: string;
  readonly x: (unit: LengthUnit) => string;
  readonly y: (unit: LengthUnit) => string;
  readonly series: SeriesOf;
}

const CHARTS: readonly ChartDef[] = [
  {
    id: "camber",
    title: "Camber over travel",
    description: "Rack centred; travel − droop, + bump; camber + when the wheel top leans outboard.",
    x: lengthAxisUnit,
    y: () => "°",
    series: (a, u) => a.travel.map((t) => ({ x: chartLength(t.travelMm, u), y: chartValue(t.camberDeg) })),
  },
  {
    id: "roll-centre",
    title: "Roll centre height over travel",
    description: "Above the ground under the wheel; a gap where the arms are parallel.",
    x: lengthAxisUnit,
    y: lengthAxisUnit,
    series: (a, u) => a.travel.map((t) => ({ x: chartLength(t.travelMm, u), y: chartLength(t.rollCentreHeightMm, u) })),
  },
  {
    id: "lock",
    title: "Steer lock over travel",
    description: "Inner road-wheel angle at lock at each travel position.",
    x: lengthAxisUnit,
    y: () => "°",
    series: (a, u) => a.steerLock.perTravel.map((l) => ({ x: chartLength(l.travelMm, u), y: chartValue(l.innerDeg) })),
  },
  {
    id: "joint",
    title: "Joint angle over rack travel",
    description: "At ride height; the larger of the two wheels' joint angles.",
    x: lengthAxisUnit,
    y: () => "°",
    series: (a, u) => a.steering.steps.map((s) => ({ x: chartLength(s.rackMm, u), y: chartValue(Math.max(s.leftJointAngleDeg, s.rightJointAngleDeg)) })),
  },
  {
    id: "ackermann",
    title: "Ackermann: outer against inner wheel",
    description: "One turn at ride height; 100 % Ackermann would have the wheel axes meet on the rear axle line.",
    x: () => "°",
    y: () => "°",
    series: (a) => ackermannPlotRows(a).map((r) => ({ x: r.inner, y: r.outer })),
  },
];

function OverlayChart({ def, items, labels, unit }: { def: ChartDef; items: readonly ComparedItem[]; labels: readonly string[]; unit: LengthUnit }) {
  const lines = items.flatMap((it, i) => (it.analysis ? [{ i, data: def.series(it.analysis, unit).filter((p) => p.x !== null) }] : []));
  return (
    <PlotCard testId={`compare-plot-${def.id}`} title={def.title} description={def.description}>
      {(captionId) =>
        lines.length === 0 ? (
          <PlotEmpty>No figures to plot.</PlotEmpty>
        ) : (
          <div className="h-60">
            <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 420, height: 240 }}>
              <LineChart margin={{ left: 0, right: 10, top: 4, bottom: 4 }} aria-labelledby={captionId}>
                <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
                <XAxis dataKey="x" type="number" domain={["dataMin", "dataMax"]} unit={def.x(unit)} fontSize={11} allowDuplicatedCategory={false} />
                <YAxis fontSize={11} unit={def.y(unit)} width={52} domain={["auto", "auto"]} />
                <Tooltip />
                <Legend wrapperStyle={{ fontSize: 11 }} />
                {lines.map(({ i, data }) => (
                  <Line key={i} data={data} dataKey="y" name={`${itemLetter(i)}: ${labels[i]}`} stroke={ITEM_STYLES[i]!.colour} strokeDasharray={ITEM_STYLES[i]!.dash} strokeWidth={2} dot={false} isAnimationActive={false} connectNulls={false} />
                ))}
              </LineChart>
            </ResponsiveContainer>
          </div>
        )
      }
    </PlotCard>
  );
}

export function OverlayPlots({ items, labels, unit }: { items: readonly ComparedItem[]; labels: readonly string[]; unit: LengthUnit }) {
  return (
    <div className="grid gap-3 md:grid-cols-2 xl:grid-cols-3" data-testid="compare-plots">
      {CHARTS.map((c) => <OverlayChart key={c.id} def={c} items={items} labels={labels} unit={unit} />)}
    </div>
  );
}
