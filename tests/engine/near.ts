import { expect } from "vitest";
import { GeometryError } from "@/engine/errors";

/** Angle tolerance of the reference sheet: ±0.001° (REFERENCES.md, suggested test tolerances). */
export const DEG_TOL = 1e-3;

/** |actual − expected| ≤ tol, with both values in the failure message. */
export function expectNear(actual: number, expected: number, tol: number, what = "value"): void {
  expect(Number.isFinite(actual), `${what} is finite`).toBe(true);
  expect(Math.abs(actual - expected), `${what}: got ${actual}, expected ${expected} ± ${tol}`).toBeLessThanOrEqual(tol);
}

/** Relative tolerance 1e-4 (REFERENCES.md) unless given. */
export function expectRel(actual: number, expected: number, rel = 1e-4, what = "value"): void {
  expectNear(actual, expected, Math.abs(expected) * rel, what);
}

/** |actual/expected − 1| < tol (REFERENCES' suggested 1e-4 relative unless a case says otherwise). */
export function expectRelClose(actual: number, expected: number, tol = 1e-4): void {
  expect(Number.isFinite(actual)).toBe(true);
  expect(Math.abs(actual / expected - 1)).toBeLessThan(tol);
}

/** `fn` throws a GeometryError naming `part` (impossible input is a named error, never NaN). */
export function expectGeometryError(fn: () => unknown, part: string): void {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(GeometryError);
    expect((error as GeometryError).part).toBe(part);
    return;
  }
  throw new Error("expected a GeometryError");
}
