// Small helpers the plots share: numbers made safe for a chart (never NaN on screen) and the
// contrast-checked colours of their series.
import type { LengthUnit } from "@/figures/length-unit";
import { lengthUnitLabel, mmToUnit } from "@/figures/length-unit";

/**
 * Series colours. Each is also legend text, so each reaches 4.5:1 on white (WCAG AA): steel 7.2:1,
 * signal 5.2:1, slate 7.6:1, limit red 6.5:1, green 5.0:1.
 */
export const SERIES = {
  steel: "#3d5a73",
  signal: "#c2410c",
  slate: "#475569",
  limit: "#b91c1c",
  good: "#15803d",
} as const;

/** A value for a chart: rounded to `digits`, null (a gap) when missing or not finite. */
export function chartValue(v: number | null | undefined, digits = 3): number | null {
  if (v === null || v === undefined || !Number.isFinite(v)) return null;
  const r = Number(v.toFixed(digits));
  return Object.is(r, -0) ? 0 : r;
}

/** A length in mm as a chart value in the user's unit (more decimals for inches). */
export function chartLength(mm: number | null | undefined, unit: LengthUnit, mmDigits = 2): number | null {
  if (mm === null || mm === undefined || !Number.isFinite(mm)) return null;
  return chartValue(mmToUnit(mm, unit), unit === "in" ? mmDigits + 2 : mmDigits);
}

/** An axis unit suffix for a length, " mm" or " in". */
export function lengthAxisUnit(unit: LengthUnit): string {
  return ` ${lengthUnitLabel(unit)}`;
}

/** A figure as text with a fixed number of decimals; a dash when missing (a chart label never says NaN). */
export function figureText(v: number | null | undefined, digits: number, suffix = ""): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  const t = v.toFixed(digits);
  return `${Number(t) === 0 ? (0).toFixed(digits) : t}${suffix}`;
}
