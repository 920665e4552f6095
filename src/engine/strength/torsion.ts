/**
 * Torsion of a round shaft neck, solid or hollow (REFERENCES §6.1; [F] amesweb torsion page, [M] Shigley ch. 3).
 * Units: diameters mm, torque N·mm, stress and modulus MPa (N/mm²), J in mm⁴, twist rad or degrees.
 */
import { GeometryError } from "../errors";
import { DEG_PER_RAD, finiteResult, requireFinite, requireNonNegative, requirePositive } from "../drive/guards";

const NECK = "shaft neck";

/** A round neck section: outer diameter, and a bore for a hollow shaft (0 or absent = solid), mm. */
export interface NeckSection {
  readonly diameterMm: number;
  readonly boreMm?: number;
}

function checkedSection(section: NeckSection): { D: number; b: number } {
  const D = requirePositive(section.diameterMm, NECK, "neck diameter");
  const b = section.boreMm === undefined ? 0 : requireNonNegative(section.boreMm, NECK, "bore");
  if (b >= D) throw new GeometryError(NECK, `bore ${b} mm is not smaller than the neck diameter ${D} mm`);
  return { D, b };
}

/** Polar second moment of area J = π (D⁴ − b⁴) / 32, mm⁴ (b = bore, 0 for solid). */
export function polarMomentMm4(section: NeckSection): number {
  const { D, b } = checkedSection(section);
  return finiteResult((Math.PI * (D ** 4 - b ** 4)) / 32, NECK, "polar moment");
}

/**
 * Largest torsional shear stress, at the outer surface: τ_max = T·(D/2)/J = 16 T D / (π (D⁴ − b⁴)), MPa;
 * solid: 16 T / (π D³). Magnitude: the sign of T (drive or brake) is ignored. T in N·mm, finite.
 */
export function torsionalShearStressMpa(torqueNmm: number, section: NeckSection): number {
  const T = Math.abs(requireFinite(torqueNmm, "drive shaft", "shaft torque"));
  const { D, b } = checkedSection(section);
  // Written without J so a solid neck keeps the exact 16T/(πD³) form.
  const tau = b === 0 ? (16 * T) / (Math.PI * D ** 3) : (16 * T * D) / (Math.PI * (D ** 4 - b ** 4));
  return finiteResult(tau, NECK, "shear stress");
}

/**
 * Angle of twist θ = T L / (G J) of a uniform length of neck, radians, signed as T.
 * T in N·mm, length L > 0 in mm, shear modulus G > 0 in MPa.
 */
export function twistAngleRad(torqueNmm: number, lengthMm: number, shearModulusMpa: number, section: NeckSection): number {
  const T = requireFinite(torqueNmm, "drive shaft", "shaft torque");
  const L = requirePositive(lengthMm, NECK, "twisted length");
  const G = requirePositive(shearModulusMpa, "material", "shear modulus");
  return finiteResult((T * L) / (G * polarMomentMm4(section)), NECK, "twist angle");
}

/** twistAngleRad in degrees. */
export function twistAngleDeg(torqueNmm: number, lengthMm: number, shearModulusMpa: number, section: NeckSection): number {
  return twistAngleRad(torqueNmm, lengthMm, shearModulusMpa, section) * DEG_PER_RAD;
}

/**
 * Smallest outer diameter of the neck that keeps τ_max ≤ S_sy / n, mm.
 * Solid: d = (16 T n / (π S_sy))^(1/3). Hollow with a fixed bore b: the root of D⁴ − k·D − b⁴ = 0,
 * k = 16 T n / (π S_sy), found by Newton's method from above (the function is convex and rising there).
 * T in N·mm (magnitude), S_sy > 0 in MPa, n > 0, b ≥ 0 in mm.
 */
export function minimumNeckDiameterMm(p: {
  readonly shaftTorqueNmm: number;
  readonly allowableShearMpa: number;
  readonly targetSafetyFactor: number;
  readonly boreMm?: number;
}): number {
  const T = Math.abs(requireFinite(p.shaftTorqueNmm, "drive shaft", "shaft torque"));
  const allowable = requirePositive(p.allowableShearMpa, "material", "allowable shear stress");
  const n = requirePositive(p.targetSafetyFactor, "drive shaft", "target safety factor");
  const b = p.boreMm === undefined ? 0 : requireNonNegative(p.boreMm, NECK, "bore");
  const k = finiteResult((16 * T * n) / (Math.PI * allowable), NECK, "minimum diameter");
  if (b === 0) return finiteResult(Math.cbrt(k), NECK, "minimum diameter");
  let D = b + Math.cbrt(k); // f(b + k^(1/3)) ≥ 0, so the root lies at or below it
  for (let i = 0; i < 100; i++) {
    const f = D ** 4 - k * D - b ** 4;
    const next = D - f / (4 * D ** 3 - k);
    if (!(next < D) || D - next <= 1e-14 * D) {
      D = Math.min(D, next);
      break;
    }
    D = next;
  }
  return finiteResult(D, NECK, "minimum diameter");
}
