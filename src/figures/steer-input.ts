// The steering input of a layout as the editor shows it: a rack (positions in mm, shown in the user's
// length unit) or a bellcrank (positions in degrees). Pure helpers for the panel, the preview and the readouts.
import type { Layout } from "@/contracts/layout";
import { fmt } from "./format";
import { formatLength, type LengthUnit } from "./length-unit";

export type SteerInputKind = Layout["topView"]["steeringInput"]["kind"];

/** Travel each way from centre, in the input's own unit (mm for a rack, degrees for a bellcrank). */
export function steerInputTravel(layout: Layout): number {
  const s = layout.topView.steeringInput;
  return s.kind === "rack" ? s.travelMm : s.travelDeg;
}

/** "rack" or "bellcrank", as a designer says it. */
export function steerInputWord(kind: SteerInputKind): string {
  return kind === "rack" ? "rack" : "bellcrank";
}

/** An input position as text: a rack's in the user's length unit, a bellcrank's in degrees. */
export function formatSteerInput(value: number | null | undefined, kind: SteerInputKind, unit: LengthUnit, digits = 2, signed = false): string {
  if (kind === "rack") return formatLength(value, unit, digits, signed);
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const text = fmt(value, Math.max(1, digits - 1), "°");
  return signed && Number(value.toFixed(Math.max(1, digits - 1))) > 0 ? `+${text}` : text;
}
