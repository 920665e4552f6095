import fc from "fast-check";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";

const d = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

/**
 * Random layouts near the Tarnwick 10 demo: pivots moved by a few mm, caster, camber, steering
 * points, joint and cup sizes varied within plausible 1:10 ranges. Each one passes the contract.
 */
export const layoutNearDemo: fc.Arbitrary<Layout> = fc
  .record({
    dPivots: fc.array(d(-3, 3), { minLength: 8, maxLength: 8 }),
    casterDeg: d(0, 28),
    camberDeg: d(-2.5, 1),
    armX: d(-22, -12),
    armY: d(96, 103),
    rackX: d(-24, -14),
    rackY: d(25, 45),
    rackTravelMm: d(5, 12),
    neckDiameterMm: d(3.5, 6),
    mouthDiameterMm: d(7, 10),
    pivotDepthMm: d(0.5, 3),
    ratedAngleDeg: d(25, 45),
    bumpTravelMm: d(4, 14),
    droopTravelMm: d(4, 10),
    jointType: fc.constantFrom("dogbone", "cvd", "cv-ball", "single-cardan", "double-cardan" as const),
  })
  .map((r): Layout => {
    const b = TARNWICK_10_BASE;
    const p = r.dPivots;
    return {
      ...b,
      frontView: {
        ...b.frontView,
        lowerInner: { y: b.frontView.lowerInner.y + p[0], z: b.frontView.lowerInner.z + p[1] },
        lowerOuter: { y: b.frontView.lowerOuter.y + p[2], z: b.frontView.lowerOuter.z + p[3] },
        upperInner: { y: b.frontView.upperInner.y + p[4], z: b.frontView.upperInner.z + p[5] },
        upperOuter: { y: b.frontView.upperOuter.y + p[6], z: b.frontView.upperOuter.z + p[7] },
        staticCamberDeg: r.camberDeg,
        bumpTravelMm: r.bumpTravelMm,
        droopTravelMm: r.droopTravelMm,
      },
      sideView: { casterDeg: r.casterDeg, casterOffsetMm: -5 },
      topView: {
        ...b.topView,
        steeringArmBall: { x: r.armX, y: r.armY, z: 36 },
        tieRodInner: { x: r.rackX, y: r.rackY, z: 36 },
        steeringInput: { kind: "rack", travelMm: r.rackTravelMm },
      },
      drive: {
        ...b.drive,
        jointType: r.jointType,
        ratedAngleDeg: r.ratedAngleDeg,
        cupMouthDiameterMm: r.mouthDiameterMm,
        pivotDepthMm: r.pivotDepthMm,
        neckDiameterMm: Math.min(r.neckDiameterMm, r.mouthDiameterMm - 0.5),
      },
    };
  });
