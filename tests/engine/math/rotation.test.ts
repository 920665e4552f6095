import fc from "fast-check";
import { Quaternion, Vector3 } from "three";
import { describe, expect, it } from "vitest";
import { angleNormalizeRads, degToRad, radToDeg } from "@/engine/math/angle";
import { pointRotateAboutAxis, vec3RotateAboutAxis, vec3RotateX } from "@/engine/math/rotation";
import { rootBracketedBrent, rootFirstCrossing } from "@/engine/math/root-find";
import { vec3Cross, vec3Normalize, type Vec3 } from "@/engine/math/vec3";
import { expectNear } from "../near";

// three.js is only a reference here: Quaternion.setFromAxisAngle + Vector3.applyQuaternion is an
// independent implementation of a rotation about an axis (quaternion algebra, not Rodrigues).
function threeRotate(v: Vec3, axis: Vec3, angleRad: number): Vec3 {
  const q = new Quaternion().setFromAxisAngle(new Vector3(...axis), angleRad);
  const r = new Vector3(...v).applyQuaternion(q);
  return [r.x, r.y, r.z];
}

const finite = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true });
const vector = fc.tuple(finite(-100, 100), finite(-100, 100), finite(-100, 100));
const unitAxis = fc
  .tuple(finite(-1, 1), finite(-1, 1), finite(-1, 1))
  .filter((v) => Math.hypot(...v) > 0.1)
  .map((v) => vec3Normalize(v) as Vec3);

describe("Rodrigues rotation against three.js quaternions", () => {
  it("agrees for random vectors, axes and angles (1e-9 mm)", () => {
    fc.assert(
      fc.property(vector, unitAxis, finite(-2 * Math.PI, 2 * Math.PI), (v, k, a) => {
        const ours = vec3RotateAboutAxis(v, k, a);
        const ref = threeRotate(v, k, a);
        for (let i = 0; i < 3; i++) expect(Math.abs(ours[i] - ref[i])).toBeLessThan(1e-9);
      }),
      { numRuns: 500 },
    );
  });

  it("rotates about a line through a point like three.js after a shift to the origin", () => {
    const p: Vec3 = [10, 120, 30];
    const c: Vec3 = [-3, 108, 23];
    const k = vec3Normalize([-0.4, -0.17, 1]) as Vec3;
    const ours = pointRotateAboutAxis(p, c, k, degToRad(33));
    const ref = threeRotate([p[0] - c[0], p[1] - c[1], p[2] - c[2]], k, degToRad(33));
    for (let i = 0; i < 3; i++) expectNear(ours[i], ref[i] + c[i], 1e-9, `component ${i}`);
  });

  it("vec3RotateX is a right-hand rotation about +x (y towards z) like three.js", () => {
    const r = vec3RotateX([1, 2, 3], 0.3);
    const ref = threeRotate([1, 2, 3], [1, 0, 0], 0.3);
    for (let i = 0; i < 3; i++) expectNear(r[i], ref[i], 1e-12, `component ${i}`);
    const quarter = vec3RotateX([0, 1, 0], Math.PI / 2);
    expectNear(quarter[2], 1, 1e-15, "y goes to z");
  });

  it("k × v is perpendicular to both (right-handed: x × y = z)", () => {
    expect(vec3Cross([1, 0, 0], [0, 1, 0])).toEqual([0, 0, 1]);
  });
});

describe("angle helpers", () => {
  it("wraps into (−π, π]", () => {
    expectNear(angleNormalizeRads(degToRad(-302.6751)), degToRad(57.3249), 1e-12, "REFERENCES §3.2 note: −302.6751° ≡ 57.3249°");
    expect(angleNormalizeRads(-Math.PI)).toBeCloseTo(Math.PI, 15);
    expectNear(radToDeg(angleNormalizeRads(degToRad(540))), 180, 1e-12, "540°");
  });
});

describe("root finding", () => {
  it("Brent finds √2 as the root of x² − 2 to 1e-12", () => {
    expectNear(rootBracketedBrent((x) => x * x - 2, 0, 2, 1e-14), Math.SQRT2, 1e-12, "√2");
  });
  it("returns NaN when the interval holds no sign change (callers raise a named error)", () => {
    expect(Number.isNaN(rootBracketedBrent((x) => x * x + 1, -1, 1))).toBe(true);
  });
  it("finds the first crossing along samples, not a later one", () => {
    const xs = Array.from({ length: 21 }, (_, i) => i * 0.5);
    const r = rootFirstCrossing((x) => Math.sin(x) - 0.5, xs);
    expectNear(r ?? NaN, Math.PI / 6, 1e-9, "first root of sin x = 1/2");
    expect(rootFirstCrossing((x) => x + 1, xs)).toBeNull();
  });
});
