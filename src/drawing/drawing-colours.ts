// The drawing's colours, chosen once. Text colours pass WCAG AA (4.5:1) on the white canvas.
import type { ClearanceState } from "./joint-section-geometry";

export const INK = {
  arm: "#475569",
  knuckle: "#1e293b",
  tyreFill: "#e5e7eb",
  tyreStroke: "#6b7280",
  shaft: "#9a3412",
  kingpin: "#6d28d9",
  construction: "#0e7490",
  ground: "#57534e",
  handle: "#1d4ed8",
  handleFill: "#ffffff",
  fault: "#b91c1c",
  gridMinor: "#eef2f6",
  gridMajor: "#d8dee6",
  label: "#1f2937",
  ghost: "#94a3b8",
} as const;

export const CLEARANCE_COLOUR: Record<ClearanceState, string> = {
  clear: "#15803d",
  close: "#b45309",
  touching: "#b91c1c",
};

export const CLEARANCE_LABEL: Record<ClearanceState, string> = {
  clear: "clear",
  close: "close",
  touching: "touching",
};

export const CANVAS_FONT = "system-ui, -apple-system, 'Segoe UI', sans-serif";

/** The part's colour, or the fault colour when a fault names this part. */
export function partColour(faultPart: string | null, part: string, normal: string): string {
  return faultPart === part ? INK.fault : normal;
}
