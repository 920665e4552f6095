"use client";
// The drive joint's operating angle over steer × travel as a coloured map (analysis.envelope), with the
// contour where it reaches the joint's limit and the steer lock at each travel (analysis.steerLock).
import { scaleLinear, scaleSequential } from "d3-scale";
import { interpolateViridis } from "d3-scale-chromatic";
import { useId, useMemo, useState } from "react";
import type { AnalysisResult } from "@/engine";
import { mmToUnit, type LengthUnit } from "@/figures/length-unit";
import { envelopeCells, limitContour, lockLines, type EnvelopeCell, type MapPoint } from "./envelope-map-geometry";
import { PlotCard, PlotEmpty } from "./plot-card";
import { figureText, lengthAxisUnit, SERIES } from "./plot-data";

export interface JointEnvelopeMapProps {
  readonly analysis: AnalysisResult | null;
  readonly lengthUnit: LengthUnit;
  readonly stale?: boolean;
}

const W = 520;
const H = 290;
const M = { left: 54, right: 12, top: 10, bottom: 38 };
const LEGEND_W = 260;

const LIMIT_BY: Record<AnalysisResult["drive"]["jointLimitBy"], string> = {
  "neck-contact": "the neck meeting the cup mouth",
  "slot-limit": "the end of the cup's slot",
  "rated-angle": "the joint's rated angle",
};

export function JointEnvelopeMap({ analysis, lengthUnit, stale }: JointEnvelopeMapProps) {
  const rawId = useId();
  const gradientId = `envelope-ramp-${rawId.replace(/[^a-zA-Z0-9_-]/g, "")}`;
  const summaryId = `${gradientId}-summary`;
  const [hover, setHover] = useState<EnvelopeCell | null>(null);
  const model = useMemo(() => (analysis ? envelopeModel(analysis, lengthUnit) : null), [analysis, lengthUnit]);
  const u = lengthAxisUnit(lengthUnit);

  return (
    <PlotCard testId="plot-envelope" title="Joint angle over steer and travel" stale={stale}
      description="Left wheel. Across: road-wheel angle (+ left turn); up: wheel travel (+ bump). Colour: the drive joint's operating angle.">
      {(captionId) =>
        !analysis || !model ? (
          <PlotEmpty>No envelope yet: the layout has not been analysed.</PlotEmpty>
        ) : (
          <div>
            <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-labelledby={captionId} aria-describedby={summaryId} onMouseLeave={() => setHover(null)}>
              <defs>
                <linearGradient id={gradientId} x1="0" x2="1" y1="0" y2="0">
                  {model.rampStops.map((s) => <stop key={s.offset} offset={s.offset} stopColor={s.colour} />)}
                </linearGradient>
              </defs>
              <g data-testid="envelope-cells">
                {model.cells.map((c) => (
                  <rect key={`${c.i}-${c.j}`} data-cell="" x={model.x(c.x0)} y={model.y(c.y1)} width={Math.max(0.5, model.x(c.x1) - model.x(c.x0))} height={Math.max(0.5, model.y(c.y0) - model.y(c.y1))}
                    fill={model.colour(c.jointAngleDeg)} onMouseEnter={() => setHover(c)} />
                ))}
              </g>
              <g data-testid="envelope-limit-contour" fill="none" strokeLinecap="round">
                {model.contour.map(([a, b], k) => <line key={`w${k}`} x1={a[0]} y1={a[1]} x2={b[0]} y2={b[1]} stroke="#fff" strokeWidth={4} />)}
                {model.contour.map(([a, b], k) => <line key={`r${k}`} x1={a[0]} y1={a[1]} x2={b[0]} y2={b[1]} stroke={SERIES.limit} strokeWidth={2} />)}
              </g>
              <g data-testid="envelope-lock-line" fill="none">
                {[model.lockLeft, model.lockRight].map((pts, k) => (
                  <g key={k}>
                    <polyline points={pts} stroke="#fff" strokeWidth={4} />
                    <polyline points={pts} stroke="#111" strokeWidth={1.75} strokeDasharray="5 3" />
                  </g>
                ))}
              </g>
              <g fontSize={11} fill="currentColor" className="text-ink">
                <line x1={M.left} x2={W - M.right} y1={H - M.bottom} y2={H - M.bottom} stroke="#0006" />
                <line x1={M.left} x2={M.left} y1={M.top} y2={H - M.bottom} stroke="#0006" />
                {model.xTicks.map((t) => (
                  <g key={`x${t}`}>
                    <line x1={model.x(t)} x2={model.x(t)} y1={H - M.bottom} y2={H - M.bottom + 4} stroke="#0006" />
                    <text x={model.x(t)} y={H - M.bottom + 15} textAnchor="middle">{`${figureText(t, 0)}°`}</text>
                  </g>
                ))}
                {model.yTicks.map((t) => (
                  <g key={`y${t}`}>
                    <line x1={M.left - 4} x2={M.left} y1={model.yAt(t)} y2={model.yAt(t)} stroke="#0006" />
                    <text x={M.left - 6} y={model.yAt(t) + 3.5} textAnchor="end">{figureText(t, model.yDigits)}</text>
                  </g>
                ))}
                <text x={(M.left + W - M.right) / 2} y={H - 4} textAnchor="middle">road-wheel angle, ° (+ left turn)</text>
                <text transform={`translate(12 ${(M.top + H - M.bottom) / 2}) rotate(-90)`} textAnchor="middle">{`travel,${u} (+ bump)`}</text>
              </g>
            </svg>
            <EnvelopeLegend model={model} gradientId={gradientId} />
            <p id={summaryId} className="mt-1 text-xs text-ink-muted">
              {`Largest joint angle within the steer lock ${figureText(analysis.drive.maxJointAngleWithinLockDeg, 1)}°; limit ${figureText(analysis.drive.jointLimitDeg, 1)}°, set by ${LIMIT_BY[analysis.drive.jointLimitBy]}. Blank cells: the tie rod cannot reach.`}
            </p>
            <p className="text-xs tabular-nums text-ink" data-testid="envelope-hover">
              {hover
                ? `At ${figureText(analysis.envelope.leftRoadWheelDeg[hover.i]?.[hover.j], 1)}° steer, ${figureText(mmToUnit(analysis.envelope.travelMm[hover.i] ?? 0, lengthUnit), lengthUnit === "in" ? 3 : 1)}${u} travel: joint ${figureText(hover.jointAngleDeg, 1)}°`
                : "Point at a cell to read its joint angle."}
            </p>
          </div>
        )
      }
    </PlotCard>
  );
}

function EnvelopeLegend({ model, gradientId }: { model: EnvelopeModel; gradientId: string }) {
  const lx = scaleLinear().domain(model.colourDomain).range([8, LEGEND_W - 8]);
  return (
    <div data-testid="envelope-legend" className="mt-1 flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-ink">
      <svg viewBox={`0 0 ${LEGEND_W} 34`} width={LEGEND_W} height={34} role="img" aria-label={`Colour scale: joint angle from ${figureText(model.colourDomain[0], 0)}° to ${figureText(model.colourDomain[1], 0)}°`}>
        <rect x={8} y={2} width={LEGEND_W - 16} height={10} fill={`url(#${gradientId})`} />
        <line x1={lx(model.limitDeg)} x2={lx(model.limitDeg)} y1={0} y2={14} stroke={SERIES.limit} strokeWidth={2} />
        {model.legendTicks.map((t) => (
          <text key={t} x={lx(t)} y={27} fontSize={10} textAnchor="middle" fill="currentColor">{`${figureText(t, 0)}°`}</text>
        ))}
      </svg>
      <span className="inline-flex items-center gap-1">
        <svg width={22} height={8} aria-hidden="true"><line x1={1} x2={21} y1={4} y2={4} stroke={SERIES.limit} strokeWidth={2} /></svg>
        <span style={{ color: SERIES.limit }}>{`joint limit ${figureText(model.limitDeg, 1)}°`}</span>
      </span>
      <span className="inline-flex items-center gap-1">
        <svg width={22} height={8} aria-hidden="true"><line x1={1} x2={21} y1={4} y2={4} stroke="#111" strokeWidth={1.75} strokeDasharray="5 3" /></svg>
        <span>steer lock</span>
      </span>
    </div>
  );
}

type EnvelopeModel = NonNullable<ReturnType<typeof envelopeModel>>;

/** Everything the map draws, in svg units; travel converted to the user's unit for the axis. */
function envelopeModel(a: AnalysisResult, unit: LengthUnit) {
  const cells = envelopeCells(a.envelope);
  const limitDeg = a.drive.jointLimitDeg;
  const lock = lockLines(a.steerLock.perTravel);
  const xs = cells.flatMap((c) => [c.x0, c.x1]).concat(lock.leftTurn.map((p) => p[0]), lock.rightTurn.map((p) => p[0]));
  const ys = cells.flatMap((c) => [c.y0, c.y1]);
  if (cells.length === 0 || xs.length === 0) return null;
  const ty = (mm: number) => mmToUnit(mm, unit);
  const x = scaleLinear().domain([Math.min(...xs), Math.max(...xs)]).range([M.left, W - M.right]).nice();
  const yDomain = [ty(Math.min(...ys)), ty(Math.max(...ys))];
  const yUnit = scaleLinear().domain(yDomain).range([H - M.bottom, M.top]);
  const y = (mm: number) => yUnit(ty(mm));
  const values = cells.map((c) => c.jointAngleDeg);
  const colourDomain: [number, number] = [Math.min(0, ...values), Math.max(limitDeg, ...values)];
  const colourScale = scaleSequential(interpolateViridis).domain(colourDomain);
  const toSvg = (p: MapPoint) => [x(p[0]), y(p[1])] as const;
  const poly = (pts: MapPoint[]) => pts.map((p) => toSvg(p).map((v) => v.toFixed(1)).join(",")).join(" ");
  const yTicks = yUnit.ticks(6);
  return {
    cells,
    x,
    y,
    /** A travel already in the user's unit (the axis ticks) to svg y. */
    yAt: (v: number) => yUnit(v),
    colour: (deg: number) => colourScale(deg),
    colourDomain,
    limitDeg,
    contour: limitContour(a.envelope, limitDeg).map(([p, q]) => [toSvg(p), toSvg(q)] as const),
    lockLeft: poly(lock.leftTurn),
    lockRight: poly(lock.rightTurn),
    xTicks: x.ticks(8),
    yTicks,
    yDigits: Math.max(0, -Math.floor(Math.log10(Math.abs((yTicks[1] ?? 1) - (yTicks[0] ?? 0)) || 1))),
    legendTicks: scaleLinear().domain(colourDomain).ticks(5),
    rampStops: Array.from({ length: 11 }, (_, k) => ({ offset: `${k * 10}%`, colour: colourScale(colourDomain[0] + ((colourDomain[1] - colourDomain[0]) * k) / 10) })),
  };
}
