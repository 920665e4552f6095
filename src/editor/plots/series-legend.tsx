// A chart's legend in words: each series named (its unit in brackets) beside a short sample of its own
// line, solid or dashed as drawn, and nothing else (no markers a line does not have). Series colours are
// also legend text, so each must reach 4.5:1 on white (plot-data.ts SERIES).
export interface LegendSeries {
  readonly name: string;
  readonly colour: string;
  /** SVG dash pattern of the series' line, e.g. "6 3"; absent = solid. */
  readonly dash?: string;
  readonly width?: number;
}

export function SeriesLegend({ series, testId = "series-legend" }: { series: readonly LegendSeries[]; testId?: string }) {
  return (
    <ul data-testid={testId} className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs">
      {series.map((s) => (
        <li key={s.name} className="inline-flex items-center gap-1.5">
          <svg width={24} height={8} aria-hidden="true" focusable="false">
            <line x1={1} x2={23} y1={4} y2={4} stroke={s.colour} strokeWidth={s.width ?? 2} strokeDasharray={s.dash} />
          </svg>
          <span style={{ color: s.colour }}>{s.name}</span>
        </li>
      ))}
    </ul>
  );
}
