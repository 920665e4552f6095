/**
 * Demo layouts: one invented 1:10 four-wheel-drive buggy, the "Tarnwick 10" (a name of our own, not a
 * real product), and a few variants a designer would try. Plausible 1:10 figures: track ≈ 245 mm,
 * wheelbase 280 mm, tyre radius 42 mm, caster 22°, kingpin inclination ≈ 10°, dogbone rated 30°.
 * The rack throws ±6.5 mm: short of the tie rod's toggle (about 7.1 mm at full bump, 7.35 mm at ride
 * height) with room to spare, and further than the drive joint allows, so each kit gets the steering stop
 * the analysis proposes (as a servo's end points or a stop on the rack would give it).
 */
import type { Layout } from "./layout";

/** The baseline: 5.0 mm steel dogbone neck in a closed 8 mm cup, 4140 steel, brushless 4000 Kv at 80 A. */
export const TARNWICK_10_BASE: Layout = {
  schema: 2,
  frontView: {
    lowerInner: { y: 30, z: 24 },
    lowerOuter: { y: 110, z: 23 },
    upperInner: { y: 50, z: 50 },
    upperOuter: { y: 104.9, z: 52 },
    wheelCentre: { y: 122, z: 42 },
    tyreRadiusMm: 42,
    tyreWidthMm: 36,
    staticCamberDeg: -1,
    bumpTravelMm: 14,
    droopTravelMm: 10,
  },
  sideView: { casterDeg: 22, casterOffsetMm: -5 },
  topView: {
    steeringArmBall: { x: -18, y: 100, z: 36 },
    tieRodInner: { x: -20, y: 35, z: 36 },
    steeringInput: { kind: "rack", travelMm: 6.5 },
    wheelbaseMm: 280,
  },
  drive: {
    inboardJoint: { y: 36, z: 34 },
    outboardJoint: { y: 106.6, z: 42 },
    jointType: "dogbone",
    ratedAngleDeg: 30,
    cupMouthDiameterMm: 8,
    pivotDepthMm: 2,
    neckDiameterMm: 5,
    slottedCup: false,
  },
  strength: {
    motor: { kind: "kv", kvRpmPerV: 4000, currentA: 80 },
    gearRatios: [76 / 22, 2.6],
    efficiency: 0.9,
    shaftsSharing: 2,
    material: { kind: "catalogue", id: "aisi-4140-qt-540" },
    targetSafetyFactor: 2,
  },
};

/** Same car, 4.0 mm neck: more articulation before the neck meets the mouth, less torsional strength. */
export const TARNWICK_10_THIN_NECK: Layout = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: 4 } };

/** CVD outboard joint rated 40°, 4.5 mm neck, deeper 9 mm cup. */
export const TARNWICK_10_CVD: Layout = {
  ...TARNWICK_10_BASE,
  drive: { ...TARNWICK_10_BASE.drive, jointType: "cvd", ratedAngleDeg: 40, cupMouthDiameterMm: 9, pivotDepthMm: 1.5, neckDiameterMm: 4.5 },
};

/** Printed PA12-CF dogbone with a slotted cup (the slot end stops it at 34°), 5.0 mm neck. */
export const TARNWICK_10_PRINTED: Layout = {
  ...TARNWICK_10_BASE,
  drive: { ...TARNWICK_10_BASE.drive, slottedCup: true, slotLimitDeg: 34 },
  strength: { ...TARNWICK_10_BASE.strength, material: { kind: "catalogue", id: "pa12-cf-fff-annealed" }, targetSafetyFactor: 3 },
};

/** Single cardan (universal) shafts rated 40°, hollow 5.0 mm neck with a 2 mm bore, 7075-T6 aluminium. */
export const TARNWICK_10_CARDAN: Layout = {
  ...TARNWICK_10_BASE,
  drive: { ...TARNWICK_10_BASE.drive, jointType: "single-cardan", ratedAngleDeg: 40, cupMouthDiameterMm: 9, pivotDepthMm: 1, neckDiameterMm: 5, boreDiameterMm: 2 },
  strength: { ...TARNWICK_10_BASE.strength, material: { kind: "catalogue", id: "al-7075-t6" } },
};

/**
 * Bellcrank steering instead of the rack: each inner ball on a 15 mm arm pointing rearward from a pivot at
 * (−5, 35) mm, turning ±25° (the inner ball moves about ±6.3 mm across, like the rack), 5.0 mm dogbone.
 */
export const TARNWICK_10_BELLCRANK: Layout = {
  ...TARNWICK_10_BASE,
  topView: { ...TARNWICK_10_BASE.topView, steeringInput: { kind: "bellcrank", pivot: { x: -5, y: 35 }, travelDeg: 25 } },
};

/** The demo variants by key, with a short label for kit names. */
export const DEMO_LAYOUTS: readonly { readonly key: string; readonly name: string; readonly layout: Layout }[] = [
  { key: "tarnwick-10-base", name: "Tarnwick 10 — 5.0 mm steel dogbone", layout: TARNWICK_10_BASE },
  { key: "tarnwick-10-thin-neck", name: "Tarnwick 10 — 4.0 mm steel dogbone", layout: TARNWICK_10_THIN_NECK },
  { key: "tarnwick-10-cvd", name: "Tarnwick 10 — CVD 4.5 mm", layout: TARNWICK_10_CVD },
  { key: "tarnwick-10-printed", name: "Tarnwick 10 — printed PA12-CF, slotted cup", layout: TARNWICK_10_PRINTED },
  { key: "tarnwick-10-cardan", name: "Tarnwick 10 — single cardan, hollow 7075", layout: TARNWICK_10_CARDAN },
  { key: "tarnwick-10-bellcrank", name: "Tarnwick 10 — bellcrank steering", layout: TARNWICK_10_BELLCRANK },
];
