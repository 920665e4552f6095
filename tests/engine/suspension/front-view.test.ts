import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GeometryError } from "@/engine/errors";
import { frontViewModel, frontViewPoseAtTravel, frontViewSweep, type FrontViewCorner } from "@/engine/suspension/front-view";
import { DEG_TOL, expectNear, expectRel } from "../near";

// REFERENCES §4.2 uses y outboard from the centreline — on our left corner that is +y, so the
// coordinates go in as they are. Tyre radius 30 puts the contact patch at (110, 0) under the wheel centre.
const UNEQUAL: FrontViewCorner = {
  lowerInner: { y: 25, z: 12 },
  lowerOuter: { y: 100, z: 12 },
  upperInner: { y: 45, z: 40 },
  upperOuter: { y: 95, z: 44 },
  wheelCentre: { y: 110, z: 30 },
  tyreRadiusMm: 30,
  staticCamberDeg: 0,
};

const PARALLEL: FrontViewCorner = {
  lowerInner: { y: 25, z: 12 },
  lowerOuter: { y: 100, z: 12 },
  upperInner: { y: 25, z: 44 },
  upperOuter: { y: 100, z: 44 },
  wheelCentre: { y: 110, z: 28 },
  tyreRadiusMm: 28,
  staticCamberDeg: 0,
};

describe("instant centre, roll centre, camber gain — unequal arms (REFERENCES §4.2)", () => {
  const m = frontViewModel(UNEQUAL);
  const p = frontViewPoseAtTravel(m, 0);

  it("IC at (−305, 12) and RC 3.1807 mm above the ground (suspensionsecrets IC/RC construction [F], §4.1 [D])", () => {
    expectNear(p.instantCentre![0], -305, 1e-6, "IC y");
    expectNear(p.instantCentre![1], 12, 1e-6, "IC z");
    expectRel(p.rollCentreHeightMm!, 3.1807, 1e-4, "RC height");
  });

  it("camber gain −0.138062 °/mm at the contact patch lever 415 mm (−1/ℓ, REFERENCES §4.1 [D])", () => {
    expectRel(p.camberGainDegPerMm, -0.138062, 1e-4, "camber gain");
    // The same gain from the exact four-bar by a central difference (the sheet's own cross-check).
    const h = 1e-4;
    const fd = (frontViewPoseAtTravel(m, h).camberDeg - frontViewPoseAtTravel(m, -h).camberDeg) / (2 * h);
    expectRel(fd, -0.138062, 1e-4, "finite difference");
  });

  it("camber rate per mm of lower-ball-joint rise is −0.141471 °/mm (REFERENCES §4.2)", () => {
    const h = 1e-4;
    const up = frontViewPoseAtTravel(m, h);
    const down = frontViewPoseAtTravel(m, -h);
    expectRel((up.camberDeg - down.camberDeg) / (up.lowerOuter[1] - down.lowerOuter[1]), -0.141471, 1e-4, "per lower-ball-joint mm");
  });

  it("wheel centre follows the requested travel exactly and the links keep their lengths", () => {
    for (const t of [-12, -5, 3, 9, 15]) {
      const q = frontViewPoseAtTravel(m, t);
      expectNear(q.wheelCentre[1], 30 + t, 1e-8, `wheel centre z at ${t}`);
      expectNear(Math.hypot(q.upperOuter[0] - q.lowerOuter[0], q.upperOuter[1] - q.lowerOuter[1]), m.links.couplerMm, 1e-9, "upright length");
      expectNear(Math.hypot(q.upperOuter[0] - 45, q.upperOuter[1] - 40), 50.1597, 1e-4, "upper arm length (§4.2: 50.1597)");
    }
  });
});

describe("equal parallel arms (REFERENCES §4.3)", () => {
  it("camber does not change at +5 and +10 mm; the ball joints move as the sheet lists", () => {
    const m = frontViewModel(PARALLEL);
    for (const [t, y] of [[5, 99.8331], [10, 99.3303]] as const) {
      const p = frontViewPoseAtTravel(m, t);
      expectNear(p.camberDeg, 0, 1e-10, `camber at +${t}`);
      expectNear(p.lowerOuter[0], y, 1e-4, `lower ball y at +${t}`);
      expectNear(p.upperOuter[0], y, 1e-4, `upper ball y at +${t}`);
      expect(p.instantCentre).toBeNull();
    }
    expectNear(frontViewPoseAtTravel(m, 0).rollCentreHeightMm!, 0, 1e-9, "RC on the ground for horizontal arms");
  });

  it("parallel arms sloping down outboard put the RC +7.3333 mm up; the mirror case −7.3333 mm", () => {
    const down = frontViewModel({ ...PARALLEL, lowerInner: { y: 25, z: 17 }, upperInner: { y: 25, z: 49 } });
    expectRel(frontViewPoseAtTravel(down, 0).rollCentreHeightMm!, 7.3333, 1e-4, "outer ends lower");
    expectNear(frontViewPoseAtTravel(down, 5).camberDeg, 0, 1e-10, "camber at +5");
    const up = frontViewModel({ ...PARALLEL, lowerOuter: { y: 100, z: 17 }, upperOuter: { y: 100, z: 49 }, wheelCentre: { y: 110, z: 33 }, tyreRadiusMm: 33 });
    expectRel(frontViewPoseAtTravel(up, 0).rollCentreHeightMm!, -7.3333, 1e-4, "outer ends higher");
    expectNear(frontViewPoseAtTravel(up, 5).camberDeg, 0, 1e-10, "camber at +5");
  });

  it("property: any equal-length parallel arms keep camber constant over travel", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 40, max: 120, noNaN: true }),
        fc.double({ min: -0.3, max: 0.3, noNaN: true }),
        fc.double({ min: 20, max: 45, noNaN: true }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        fc.double({ min: -12, max: 12, noNaN: true }),
        (len, slopeRad, gap, camber, travel) => {
          const dy = len * Math.cos(slopeRad);
          const dz = len * Math.sin(slopeRad);
          const corner: FrontViewCorner = {
            lowerInner: { y: 25, z: 15 },
            lowerOuter: { y: 25 + dy, z: 15 + dz },
            upperInner: { y: 25, z: 15 + gap },
            upperOuter: { y: 25 + dy, z: 15 + gap + dz },
            wheelCentre: { y: 35 + dy, z: 15 + dz + gap / 2 },
            tyreRadiusMm: 15 + dz + gap / 2,
            staticCamberDeg: camber,
          };
          const p = frontViewPoseAtTravel(frontViewModel(corner), travel);
          expectNear(p.camberDeg, camber, 1e-9, "camber");
          expect(p.camberGainDegPerMm).toBeCloseTo(0, 12);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe("cannot close", () => {
  it("names the front suspension and the travel it cannot reach", () => {
    const m = frontViewModel(UNEQUAL);
    expect(() => frontViewPoseAtTravel(m, 200)).toThrowError(GeometryError);
    expect(() => frontViewPoseAtTravel(m, 200)).toThrowError(/front suspension: arms cannot close at 200\.00 mm of bump/);
  });

  it("a sweep reports every step or throws; it never returns NaN", () => {
    const poses = frontViewSweep(frontViewModel(UNEQUAL), [-10, -5, 0, 5, 10]);
    for (const p of poses) for (const v of [p.camberDeg, p.trackChangeMm, p.camberGainDegPerMm, p.rollCentreHeightMm ?? 0]) expect(Number.isFinite(v)).toBe(true);
    expectNear(poses[2].camberDeg, 0, DEG_TOL, "static camber");
  });

  it("coincident pivots are a named error", () => {
    expect(() => frontViewModel({ ...UNEQUAL, lowerOuter: { y: 25, z: 12 } })).toThrowError(/lower arm: inner and outer pivots coincide/);
  });
});
