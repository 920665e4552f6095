// Grid snapping and keyboard nudges, in mm. The grid step is the user's (set in their unit, kept in mm).
import { MM_PER_INCH, type LengthUnit } from "@/figures/length-unit";
import { roundMm } from "../commands/edit-commands";

/** Grid steps offered in each unit, in mm: metric steps, and binary fractions of an inch. */
export const GRID_STEPS_MM: Record<LengthUnit, readonly number[]> = {
  mm: [0.1, 0.25, 0.5, 1, 2, 5],
  in: [1 / 64, 1 / 32, 1 / 16, 1 / 8, 1 / 4].map((f) => f * MM_PER_INCH),
};

export const DEFAULT_GRID_STEP_MM = 0.5;

/** Label of a grid step in the user's unit ("0.5 mm", "1/32 in"). */
export function gridStepLabel(stepMm: number, unit: LengthUnit): string {
  if (unit === "mm") return `${Number(stepMm.toFixed(3))} mm`;
  const denominator = Math.round(MM_PER_INCH / stepMm);
  return Math.abs(MM_PER_INCH / denominator - stepMm) < 1e-9 ? `1/${denominator} in` : `${(stepMm / MM_PER_INCH).toFixed(4)} in`;
}

/** The nearest multiple of stepMm (a step ≤ 0 leaves the value as it is). */
export function snapToStep(valueMm: number, stepMm: number): number {
  if (!(stepMm > 0)) return valueMm;
  return roundMm(Math.round(valueMm / stepMm) * stepMm);
}

/** Keyboard nudge multiplier with Shift held. */
export const SHIFT_NUDGE_FACTOR = 10;

/**
 * Plane displacement (du, dv) in mm for an arrow key: right = +u, up = +v (the views draw v up the
 * screen). One grid step, ten with Shift. Null for any other key.
 */
export function nudgeDelta(key: string, shift: boolean, stepMm: number): readonly [number, number] | null {
  const s = stepMm * (shift ? SHIFT_NUDGE_FACTOR : 1);
  switch (key) {
    case "ArrowRight":
      return [s, 0];
    case "ArrowLeft":
      return [-s, 0];
    case "ArrowUp":
      return [0, s];
    case "ArrowDown":
      return [0, -s];
    default:
      return null;
  }
}
