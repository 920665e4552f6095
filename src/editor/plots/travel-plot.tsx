"use client";
// Camber and roll-centre height against wheel travel (analysis.travel, rack centred).
import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { AnalysisResult } from "@/engine";
import type { LengthUnit } from "@/figures/length-unit";
import { PlotCard, PlotEmpty } from "./plot-card";
import { chartLength, chartValue, lengthAxisUnit, SERIES } from "./plot-data";

export interface TravelPlotProps {
  readonly analysis: AnalysisResult | null;
  readonly lengthUnit: LengthUnit;
  readonly stale?: boolean;
}

/** One row per travel step; the roll centre is a gap where the arms are parallel (no instant centre). */
export function travelPlotRows(analysis: AnalysisResult, unit: LengthUnit) {
  return analysis.travel.map((t) => ({
    travel: chartLength(t.travelMm, unit),
    camber: chartValue(t.camberDeg),
    rollCentre: chartLength(t.rollCentreHeightMm, unit),
  }));
}

export function TravelPlot({ analysis, lengthUnit, stale }: TravelPlotProps) {
  const u = lengthAxisUnit(lengthUnit);
  const rows = analysis ? travelPlotRows(analysis, lengthUnit).filter((r) => r.travel !== null) : [];
  return (
    <PlotCard testId="plot-travel" title="Camber and roll centre over travel" stale={stale}
      description={`Wheel travel from full droop (−) to full bump (+), rack centred. Camber + when the wheel top leans outboard; roll-centre height above the ground under the wheel, in ${u.trim()}.`}>
      {(captionId) =>
        rows.length < 2 ? (
          <PlotEmpty>No travel figures yet: the layout has not been analysed.</PlotEmpty>
        ) : (
          <div className="h-60">
            <ResponsiveContainer width="100%" height="100%" initialDimension={{ width: 480, height: 240 }}>
              <LineChart data={rows} margin={{ left: 0, right: 8, top: 4, bottom: 4 }} aria-labelledby={captionId}>
                <CartesianGrid strokeDasharray="3 3" stroke="#0001" />
                <XAxis dataKey="travel" type="number" domain={["dataMin", "dataMax"]} unit={u} fontSize={11} />
                <YAxis yAxisId="camber" fontSize={11} unit="°" width={48} />
                <YAxis yAxisId="rc" orientation="right" fontSize={11} unit={u} width={56} />
                <Tooltip />
                <Legend wrapperStyle={{ fontSize: 11 }} />
                <ReferenceLine yAxisId="camber" x={0} stroke="#0003" />
                <Line yAxisId="camber" type="monotone" dataKey="camber" name="camber °" stroke={SERIES.steel} dot={false} isAnimationActive={false} />
                <Line yAxisId="rc" type="monotone" dataKey="rollCentre" name={`roll centre${u}`} stroke={SERIES.signal} strokeDasharray="6 3" dot={false} isAnimationActive={false} />
              </LineChart>
            </ResponsiveContainer>
          </div>
        )
      }
    </PlotCard>
  );
}
