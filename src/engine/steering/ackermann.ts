import { cotRads, degToRad, radToDeg } from "../math/angle";

/*
 * Ackermann relations (REFERENCES §2). w = kingpin track (distance between the steering axes' ground
 * points, mm), L = wheelbase (mm), δi / δo = inner / outer road-wheel angles in degrees, both positive
 * for the turn being made. Ideal kinematic condition: cot δo − cot δi = w / L ([M] Jazar, Vehicle
 * Dynamics ch. 7; [M] Gillespie ch. 6).
 */

/** Ideal outer angle for an inner angle: δo = acot(cot δi + w/L), degrees (δi in (0°, 90°]). */
export function ackermannIdealOuterDeg(innerDeg: number, trackMm: number, wheelbaseMm: number): number {
  return radToDeg(Math.atan2(1, cotRads(degToRad(innerDeg)) + trackMm / wheelbaseMm));
}

/** Ideal inner angle for an outer angle: δi = acot(cot δo − w/L), degrees (result in (0°, 180°)). */
export function ackermannIdealInnerDeg(outerDeg: number, trackMm: number, wheelbaseMm: number): number {
  return radToDeg(Math.atan2(1, cotRads(degToRad(outerDeg)) - trackMm / wheelbaseMm));
}

/** Turn radius to the rear-axle midpoint for an ideal inner angle: R = L·cot δi + w/2, mm. */
export function ackermannTurnRadiusMm(innerDeg: number, trackMm: number, wheelbaseMm: number): number {
  return wheelbaseMm * cotRads(degToRad(innerDeg)) + trackMm / 2;
}

/** Single-track ("bicycle") angle with cot δ = (cot δi + cot δo)/2, degrees. */
export function ackermannBicycleAngleDeg(innerDeg: number, outerDeg: number): number {
  return radToDeg(Math.atan2(2, cotRads(degToRad(innerDeg)) + cotRads(degToRad(outerDeg))));
}

/**
 * P_cot, the product's Ackermann percentage (turn-centre form, DESIGN.md): (cot δo − cot δi)/(w/L) × 100.
 * 100 % = wheel axes meet on the rear-axle line, 0 % = parallel steer, negative = reverse.
 * Angles must be non-zero (degrees); at straight ahead the figure is undefined.
 */
export function ackermannTurnCentrePercent(innerDeg: number, outerDeg: number, trackMm: number, wheelbaseMm: number): number {
  return ((cotRads(degToRad(outerDeg)) - cotRads(degToRad(innerDeg))) / (trackMm / wheelbaseMm)) * 100;
}

/** Distance behind the front axle where the two wheel-axis lines cross: x* = w/(cot δo − cot δi), mm (P_cot = L/x* × 100). */
export function ackermannAxisCrossingMm(innerDeg: number, outerDeg: number, trackMm: number): number {
  return trackMm / (cotRads(degToRad(outerDeg)) - cotRads(degToRad(innerDeg)));
}

/** P_in, inner wheel as reference: (δi − δo)/(δi − δo,ideal(δi)) × 100 (REFERENCES §2.2). */
export function ackermannInnerReferencePercent(innerDeg: number, outerDeg: number, trackMm: number, wheelbaseMm: number): number {
  return ((innerDeg - outerDeg) / (innerDeg - ackermannIdealOuterDeg(innerDeg, trackMm, wheelbaseMm))) * 100;
}

/** P_out, outer wheel as reference: (δi − δo)/(δi,ideal(δo) − δo) × 100 (REFERENCES §2.2). */
export function ackermannOuterReferencePercent(innerDeg: number, outerDeg: number, trackMm: number, wheelbaseMm: number): number {
  return ((innerDeg - outerDeg) / (ackermannIdealInnerDeg(outerDeg, trackMm, wheelbaseMm) - outerDeg)) * 100;
}

/**
 * P_static, the classic arm-line rule: 2·L·tan βa / w × 100 with βa the steering arm's angle to the
 * x axis at straight ahead (degrees). A design rule only — it is NOT the linkage's P_cot (REFERENCES §2.5).
 */
export function ackermannStaticArmPercent(armAngleDeg: number, trackMm: number, wheelbaseMm: number): number {
  return ((2 * wheelbaseMm * Math.tan(degToRad(armAngleDeg))) / trackMm) * 100;
}

/** Ackermann deviation: δo,actual − δo,ideal(δi), degrees (REFERENCES §2.2). */
export function ackermannOuterDeviationDeg(innerDeg: number, outerDeg: number, trackMm: number, wheelbaseMm: number): number {
  return outerDeg - ackermannIdealOuterDeg(innerDeg, trackMm, wheelbaseMm);
}
