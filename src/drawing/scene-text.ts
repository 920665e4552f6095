// Words and figures the drawings put beside their parts, in the designer's length unit.
import { lengthDigits, mmToUnit, type LengthUnit } from "@/figures/length-unit";
import type { PlanePoint } from "./view-transform";

/** A plane point as "(u, v)" in the unit, one decimal in mm (three in inches); the unit is the sheet's. */
export function coordinateText(p: PlanePoint, unit: LengthUnit): string {
  const digits = lengthDigits(unit, 1);
  const n = (v: number) => {
    const text = mmToUnit(v, unit).toFixed(digits);
    return Number(text) === 0 ? (0).toFixed(digits) : text;
  };
  return `(${n(p[0])}, ${n(p[1])})`;
}

