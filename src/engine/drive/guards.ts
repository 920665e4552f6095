import { GeometryError } from "../errors";

/** Throws a GeometryError for `part` unless `value` is a finite number; returns it otherwise. */
export function requireFinite(value: number, part: string, what: string): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new GeometryError(part, `${what} must be a finite number (got ${String(value)})`);
  }
  return value;
}

/** Finite and strictly positive. */
export function requirePositive(value: number, part: string, what: string): number {
  requireFinite(value, part, what);
  if (value <= 0) throw new GeometryError(part, `${what} must be greater than 0 (got ${value})`);
  return value;
}

/** Finite and not negative. */
export function requireNonNegative(value: number, part: string, what: string): number {
  requireFinite(value, part, what);
  if (value < 0) throw new GeometryError(part, `${what} must not be negative (got ${value})`);
  return value;
}

/** Guards a computed result: a NaN or an overflow becomes a named error, never an output. */
export function finiteResult(value: number, part: string, what: string): number {
  if (!Number.isFinite(value)) {
    throw new GeometryError(part, `${what} cannot be computed for these inputs (out of numeric range)`);
  }
  return value;
}

export const RAD_PER_DEG = Math.PI / 180;
export const DEG_PER_RAD = 180 / Math.PI;
