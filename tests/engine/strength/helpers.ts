import { expect } from "vitest";
import { GeometryError } from "@/engine/errors";

/** |actual/expected − 1| < tol (REFERENCES' suggested 1e-4 relative unless a case says otherwise). */
export function expectRelClose(actual: number, expected: number, tol = 1e-4): void {
  expect(Number.isFinite(actual)).toBe(true);
  expect(Math.abs(actual / expected - 1)).toBeLessThan(tol);
}

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
