// Lengths are stored and computed in millimetres; the editor shows and takes them in the user's unit.
// Conversions go only through these functions so a figure is never converted twice.

export const LENGTH_UNITS = ["mm", "in"] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

/** Millimetres per inch, exact by definition (1 in = 25.4 mm, international yard and pound agreement, 1959). */
export const MM_PER_INCH = 25.4;

export function isLengthUnit(v: unknown): v is LengthUnit {
  return v === "mm" || v === "in";
}

/** A length in mm as the user's unit shows it. */
export function mmToUnit(mm: number, unit: LengthUnit): number {
  return unit === "in" ? mm / MM_PER_INCH : mm;
}

/** A length typed in the user's unit, back to mm. */
export function unitToMm(value: number, unit: LengthUnit): number {
  return unit === "in" ? value * MM_PER_INCH : value;
}

/** Decimals that keep about the same resolution in either unit (0.01 mm ≈ 0.0004 in). */
export function lengthDigits(unit: LengthUnit, mmDigits = 2): number {
  return unit === "in" ? mmDigits + 2 : mmDigits;
}

/** Unit label as shown beside a figure. */
export function lengthUnitLabel(unit: LengthUnit): string {
  return unit === "in" ? "in" : "mm";
}

/** A length in mm formatted in the user's unit, e.g. "3.20 mm" or "0.1260 in"; a dash when not finite. */
export function formatLength(mm: number | null | undefined, unit: LengthUnit, mmDigits = 2, signed = false): string {
  if (mm === null || mm === undefined || !Number.isFinite(mm)) return "—";
  const digits = lengthDigits(unit, mmDigits);
  const v = mmToUnit(mm, unit);
  let text = v.toFixed(digits);
  if (Number(text) === 0) text = (0).toFixed(digits);
  else if (signed && v > 0) text = `+${text}`;
  return `${text} ${lengthUnitLabel(unit)}`;
}
