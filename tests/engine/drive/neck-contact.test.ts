import fc from "fast-check";
import { Quaternion, Vector3 } from "three";
import { expectGeometryError } from "../near";
import { describe, expect, it } from "vitest";
import { GeometryError } from "@/engine/errors";
import {
  cupArticulationLimit,
  neckClearanceMm,
  neckContactAngleDeg,
  neckContactSensitivityDegPerMm,
  steppedMouthClearanceMm,
  type CupRimEdge,
} from "@/engine/drive/neck-contact";

const ANGLE_TOL_DEG = 1e-3; // ±0.001°, REFERENCES' suggested tolerance for angles
const deg = (rad: number) => (rad * 180) / Math.PI;


/**
 * Independent method: the neck as a ray from the pivot, tilted by β in a plane at azimuth φ with three.js
 * quaternions; rim edges sampled around their circumference; the first β where any sampled rim point comes
 * within d/2 of the neck axis is found by stepping and bisection. Knows nothing of the closed form.
 */
function bruteForceContactDeg(neckDiameterMm: number, rims: readonly CupRimEdge[], azimuthDeg: number): number {
  const samples = 7200;
  const rimPoints = rims.flatMap((rim) =>
    Array.from({ length: samples }, (_, i) => {
      const psi = (2 * Math.PI * i) / samples;
      return new Vector3((rim.diameterMm / 2) * Math.cos(psi), (rim.diameterMm / 2) * Math.sin(psi), rim.depthMm);
    }),
  );
  const phi = (azimuthDeg * Math.PI) / 180;
  const hinge = new Vector3(-Math.sin(phi), Math.cos(phi), 0);
  const touches = (betaDeg: number) => {
    const axis = new Vector3(0, 0, 1).applyQuaternion(new Quaternion().setFromAxisAngle(hinge, (betaDeg * Math.PI) / 180));
    return rimPoints.some((p) => {
      const t = p.dot(axis);
      const distance = t <= 0 ? p.length() : p.clone().sub(axis.clone().multiplyScalar(t)).length();
      return distance <= neckDiameterMm / 2;
    });
  };
  let lo = 0;
  let hi = 0.5;
  while (!touches(hi)) {
    lo = hi;
    hi += 0.5;
    if (hi > 90) return 90;
  }
  for (let i = 0; i < 40; i++) {
    const mid = (lo + hi) / 2;
    if (touches(mid)) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}

describe("neck contact angle — REFERENCES §8.2 check cases (derived, REFERENCES §8.1 [D])", () => {
  const rows = [
    { D: 8, d: 5, a: 0, beta: 51.3178, slope: -9.1747 },
    { D: 8, d: 5, a: 2, beta: 29.4471, slope: -7.7258 },
    { D: 8, d: 4, a: 2, beta: 36.8699, slope: -7.162 },
    { D: 8, d: 6, a: 2, beta: 21.3045, slope: -8.6377 },
    { D: 10, d: 6, a: 3, beta: 28.0725, slope: -5.7296 },
  ];
  it.each(rows)("D=$D d=$d a=$a → β_max $beta°, dβ/dd $slope °/mm", ({ D, d, a, beta, slope }) => {
    const p = { mouthDiameterMm: D, neckDiameterMm: d, pivotDepthMm: a };
    expect(Math.abs(neckContactAngleDeg(p) - beta)).toBeLessThan(ANGLE_TOL_DEG);
    // the table rounds to 4 decimals, so ±1e-4 °/mm
    expect(Math.abs(neckContactSensitivityDegPerMm(p) - slope)).toBeLessThan(1e-4);
    // at the contact angle the gap closes (formula residual in the sheet < 5e-16 mm)
    expect(Math.abs(neckClearanceMm(p, neckContactAngleDeg(p)))).toBeLessThan(1e-12);
  });

  it("D=8 d=4 a=2 is the 3-4-5 case: β_max = atan(3/4) exactly (derived, REFERENCES §8.2 [D])", () => {
    const beta = neckContactAngleDeg({ mouthDiameterMm: 8, neckDiameterMm: 4, pivotDepthMm: 2 });
    expect(Math.abs(beta - deg(Math.atan(3 / 4)))).toBeLessThan(1e-9);
  });

  it("thin-neck limit d → 0 gives atan(D/2a) = atan 2 = 63.4349° (derived, REFERENCES §8.1 [D])", () => {
    const beta = neckContactAngleDeg({ mouthDiameterMm: 8, neckDiameterMm: 1e-9, pivotDepthMm: 2 });
    expect(Math.abs(beta - 63.4349)).toBeLessThan(ANGLE_TOL_DEG);
  });

  it("pivot in the mouth plane reduces to arccos(d/D) (derived, REFERENCES §8.1 [D])", () => {
    const beta = neckContactAngleDeg({ mouthDiameterMm: 7, neckDiameterMm: 3.5, pivotDepthMm: 0 });
    expect(Math.abs(beta - 60)).toBeLessThan(1e-9); // arccos(1/2)
  });

  it("the sensitivity matches a central finite difference of the angle (independent numerical check)", () => {
    const base = { mouthDiameterMm: 9, neckDiameterMm: 5.2, pivotDepthMm: 2.4 };
    const h = 1e-5;
    const numeric =
      (neckContactAngleDeg({ ...base, neckDiameterMm: 5.2 + h }) - neckContactAngleDeg({ ...base, neckDiameterMm: 5.2 - h })) /
      (2 * h);
    expect(Math.abs(neckContactSensitivityDegPerMm(base) / numeric - 1)).toBeLessThan(1e-4);
  });

  it("clearance is positive before contact and negative past it", () => {
    const p = { mouthDiameterMm: 8, neckDiameterMm: 5, pivotDepthMm: 2 };
    expect(neckClearanceMm(p, 0)).toBeCloseTo(1.5, 12); // (8 − 5)/2 straight
    expect(neckClearanceMm(p, 29)).toBeGreaterThan(0);
    expect(neckClearanceMm(p, 30)).toBeLessThan(0);
    expect(neckClearanceMm(p, -29)).toBeCloseTo(neckClearanceMm(p, 29), 12);
  });
});

describe("neck contact — 3-D brute force (independent method: three.js rotation, sampled rim)", () => {
  it("D=8 d=5 a=2 gives 29.4471° in any articulation plane (REFERENCES §8.1 quotes 29.4475° at a 0.0005° step)", () => {
    const formula = neckContactAngleDeg({ mouthDiameterMm: 8, neckDiameterMm: 5, pivotDepthMm: 2 });
    for (const azimuth of [0, 37, 123.5]) {
      expect(Math.abs(bruteForceContactDeg(5, [{ diameterMm: 8, depthMm: 2 }], azimuth) - formula)).toBeLessThan(ANGLE_TOL_DEG);
    }
  });

  it("agrees on further sizes, including a pivot in the mouth plane", () => {
    for (const [D, d, a] of [
      [10, 6, 3],
      [6.5, 3.2, 1.1],
      [8, 5, 0],
    ]) {
      const formula = neckContactAngleDeg({ mouthDiameterMm: D, neckDiameterMm: d, pivotDepthMm: a });
      expect(Math.abs(bruteForceContactDeg(d, [{ diameterMm: D, depthMm: a }], 71) - formula)).toBeLessThan(ANGLE_TOL_DEG);
    }
  });

  it("a chamfered mouth binds on whichever edge the brute force touches first", () => {
    // a 45° chamfer: 8.6 mm at the mouth plane (a = 2), 8 mm bore 0.3 mm deeper (a = 1.7)
    const chamfer: CupRimEdge[] = [
      { diameterMm: 8.6, depthMm: 2 },
      { diameterMm: 8, depthMm: 1.7 },
    ];
    const limit = cupArticulationLimit(5, { kind: "stepped", rimEdges: chamfer });
    expect(limit.limitedBy).toBe("mouth-rim");
    expect(Math.abs(limit.limitDeg - bruteForceContactDeg(5, chamfer, 15))).toBeLessThan(ANGLE_TOL_DEG);
    const each = chamfer.map((e) => neckContactAngleDeg({ mouthDiameterMm: e.diameterMm, neckDiameterMm: 5, pivotDepthMm: e.depthMm }));
    expect(limit.rimEdgeIndex).toBe(each[0] < each[1] ? 0 : 1);
    expect(Math.abs(steppedMouthClearanceMm(5, chamfer, limit.limitDeg))).toBeLessThan(1e-12);
  });
});

describe("cup kinds", () => {
  it("a plain mouth reports the rim and edge 0", () => {
    const limit = cupArticulationLimit(5, { kind: "plain", mouthDiameterMm: 8, pivotDepthMm: 2 });
    expect(limit).toEqual({ limitDeg: neckContactAngleDeg({ mouthDiameterMm: 8, neckDiameterMm: 5, pivotDepthMm: 2 }), limitedBy: "mouth-rim", rimEdgeIndex: 0 });
  });

  it("a slotted cup is limited by its slot angle instead of the mouth", () => {
    expect(cupArticulationLimit(5, { kind: "slotted", slotAngleDeg: 32 })).toEqual({ limitDeg: 32, limitedBy: "slot", rimEdgeIndex: null });
    expectGeometryError(() => cupArticulationLimit(5, { kind: "slotted", slotAngleDeg: 0 }), "cup mouth");
    expectGeometryError(() => cupArticulationLimit(5, { kind: "slotted", slotAngleDeg: 95 }), "cup mouth");
    expectGeometryError(() => cupArticulationLimit(5, { kind: "stepped", rimEdges: [] }), "cup mouth");
  });
});

describe("neck contact — invalid input is a named error, never NaN", () => {
  it("a neck as wide as or wider than the mouth", () => {
    expectGeometryError(() => neckContactAngleDeg({ mouthDiameterMm: 8, neckDiameterMm: 8, pivotDepthMm: 2 }), "shaft neck");
    expectGeometryError(() => neckContactAngleDeg({ mouthDiameterMm: 8, neckDiameterMm: 9, pivotDepthMm: 0 }), "shaft neck");
    expectGeometryError(() => neckContactSensitivityDegPerMm({ mouthDiameterMm: 8, neckDiameterMm: 9, pivotDepthMm: 0 }), "shaft neck");
  });

  it("non-finite, zero or negative sizes and angles", () => {
    expectGeometryError(() => neckContactAngleDeg({ mouthDiameterMm: Number.NaN, neckDiameterMm: 5, pivotDepthMm: 2 }), "cup mouth");
    expectGeometryError(() => neckContactAngleDeg({ mouthDiameterMm: 8, neckDiameterMm: 0, pivotDepthMm: 2 }), "shaft neck");
    expectGeometryError(() => neckContactAngleDeg({ mouthDiameterMm: 8, neckDiameterMm: 5, pivotDepthMm: -1 }), "cup mouth");
    expectGeometryError(() => neckContactAngleDeg({ mouthDiameterMm: Infinity, neckDiameterMm: 5, pivotDepthMm: 2 }), "cup mouth");
    expectGeometryError(() => neckClearanceMm({ mouthDiameterMm: 8, neckDiameterMm: 5, pivotDepthMm: 2 }, 91), "shaft neck");
    expectGeometryError(() => neckClearanceMm({ mouthDiameterMm: 8, neckDiameterMm: 5, pivotDepthMm: 2 }, Number.NaN), "shaft neck");
  });
});

describe("neck contact — properties (fast-check)", () => {
  const size = fc.double({ min: 0.5, max: 40, noNaN: true });
  const depth = fc.double({ min: 0, max: 30, noNaN: true });
  const fraction = fc.double({ min: 0.001, max: 0.999, noNaN: true });

  it("a thinner neck never lowers the contact angle (derived, REFERENCES §8.1: dβ/dd < 0)", () => {
    fc.assert(
      fc.property(size, depth, fraction, fraction, (D, a, f1, f2) => {
        const [thin, thick] = f1 <= f2 ? [f1 * D, f2 * D] : [f2 * D, f1 * D];
        const bThin = neckContactAngleDeg({ mouthDiameterMm: D, neckDiameterMm: thin, pivotDepthMm: a });
        const bThick = neckContactAngleDeg({ mouthDiameterMm: D, neckDiameterMm: thick, pivotDepthMm: a });
        return bThin >= bThick - 1e-12;
      }),
    );
  });

  it("never exceeds the thin-neck limit atan(D/2a), nor 90° (derived, REFERENCES §8.1)", () => {
    fc.assert(
      fc.property(size, depth, fraction, (D, a, f) => {
        const beta = neckContactAngleDeg({ mouthDiameterMm: D, neckDiameterMm: f * D, pivotDepthMm: a });
        return beta <= deg(Math.atan2(D, 2 * a)) + 1e-12 && beta <= 90 && beta >= 0;
      }),
    );
  });

  it("no finite valid input gives NaN or Infinity", () => {
    fc.assert(
      fc.property(size, depth, fraction, fc.double({ min: -90, max: 90, noNaN: true }), (D, a, f, beta) => {
        const p = { mouthDiameterMm: D, neckDiameterMm: f * D, pivotDepthMm: a };
        return [neckContactAngleDeg(p), neckContactSensitivityDegPerMm(p), neckClearanceMm(p, beta)].every(Number.isFinite);
      }),
    );
  });

  it("any finite input either answers finitely or throws a GeometryError", () => {
    fc.assert(
      fc.property(fc.double(), fc.double(), fc.double(), (D, d, a) => {
        try {
          const p = { mouthDiameterMm: D, neckDiameterMm: d, pivotDepthMm: a };
          return Number.isFinite(neckContactAngleDeg(p)) && Number.isFinite(neckContactSensitivityDegPerMm(p));
        } catch (error) {
          return error instanceof GeometryError;
        }
      }),
    );
  });
});
