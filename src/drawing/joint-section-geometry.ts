// The joint section: the neck in its cup, cut through the plane of articulation, in the joint's own
// plane (mm): the pivot at the origin, the cup axis along +u (the cup opens towards −u, its mouth plane
// at u = −a), the neck leaving the pivot towards −u tilted up by the articulation β.
// Clearance between the neck and the mouth rim: (D/2)cos β − a sin β − d/2 (src/engine/drive/neck-contact.ts).
import type { PlanePoint } from "./view-transform";

export interface JointSectionInput {
  readonly mouthDiameterMm: number;
  readonly pivotDepthMm: number;
  readonly neckDiameterMm: number;
  readonly boreDiameterMm?: number;
  /** Articulation shown, degrees (≥ 0). */
  readonly betaDeg: number;
  readonly slotted: boolean;
  readonly slotLimitDeg?: number;
}

export type ClearanceState = "clear" | "close" | "touching";

/** Gaps below these show as close / touching. Our own display thresholds, not a standard. */
export const CLOSE_BELOW_MM = 0.3;
export const TOUCHING_BELOW_MM = 0.02;

export function clearanceState(clearanceMm: number): ClearanceState {
  if (clearanceMm < TOUCHING_BELOW_MM) return "touching";
  return clearanceMm < CLOSE_BELOW_MM ? "close" : "clear";
}

/** A slotted cup is judged by the angle left to the slot's end (our own display thresholds). */
export function slotState(marginDeg: number): ClearanceState {
  if (marginDeg < 0.05) return "touching";
  return marginDeg < 2 ? "close" : "clear";
}

export interface JointSection {
  /** Cup walls as closed polygons (upper and lower; the upper is absent for a slotted cup's open side). */
  readonly cupWalls: readonly (readonly PlanePoint[])[];
  /** The neck as a band (polygon) from the pivot out past the mouth. */
  readonly neck: readonly PlanePoint[];
  readonly neckAxis: readonly [PlanePoint, PlanePoint];
  /** The bore of a hollow neck, drawn inside the band. */
  readonly bore: readonly PlanePoint[] | null;
  /** The mouth rim point the neck approaches. */
  readonly rim: PlanePoint;
  /** Foot of the perpendicular from the rim to the neck surface (the clearance's other end). */
  readonly neckSurfaceNearRim: PlanePoint;
  /** Gap, mm: + clear, 0 touching, − the neck would cut the rim; null for a slotted cup. */
  readonly clearanceMm: number | null;
  readonly state: ClearanceState;
  /** The slot's end line for a slotted cup (from the pivot at the slot limit), else null. */
  readonly slotLine: readonly [PlanePoint, PlanePoint] | null;
  readonly pivotRadiusMm: number;
  /** Thickness the cup wall is drawn with, mm. */
  readonly wallMm: number;
  readonly extent: { readonly minU: number; readonly maxU: number; readonly minV: number; readonly maxV: number };
}

const RAD = Math.PI / 180;

export function jointSection(input: JointSectionInput): JointSection {
  const D = input.mouthDiameterMm;
  const a = input.pivotDepthMm;
  const d = input.neckDiameterMm;
  const beta = Math.max(0, input.betaDeg) * RAD;
  const wall = Math.max(0.25 * D, 0.8);
  const depth = Math.max(a + 0.6 * D, D * 0.9);
  const R = D / 2;
  const lower: PlanePoint[] = [[-a, -R], [depth, -R], [depth, -R - wall], [-a, -R - wall]];
  const upper: PlanePoint[] = [[-a, R], [depth, R], [depth, R + wall], [-a, R + wall]];
  const back: PlanePoint[] = [[depth, -R - wall], [depth + wall, -R - wall], [depth + wall, R + wall], [depth, R + wall]];
  const length = a + 1.6 * D + 2;
  const e: PlanePoint = [-Math.cos(beta), Math.sin(beta)];
  const nrm: PlanePoint = [Math.sin(beta), Math.cos(beta)]; // unit normal of the neck axis, towards the rim side
  const end: PlanePoint = [e[0] * length, e[1] * length];
  const h = d / 2;
  const neck: PlanePoint[] = [
    [nrm[0] * h, nrm[1] * h],
    [end[0] + nrm[0] * h, end[1] + nrm[1] * h],
    [end[0] - nrm[0] * h, end[1] - nrm[1] * h],
    [-nrm[0] * h, -nrm[1] * h],
  ];
  const b = input.boreDiameterMm ? input.boreDiameterMm / 2 : 0;
  const bore: PlanePoint[] | null = b > 0
    ? [[nrm[0] * b, nrm[1] * b], [end[0] + nrm[0] * b, end[1] + nrm[1] * b], [end[0] - nrm[0] * b, end[1] - nrm[1] * b], [-nrm[0] * b, -nrm[1] * b]]
    : null;
  const rim: PlanePoint = [-a, R];
  // Project the rim onto the neck axis, then step out to the neck's surface.
  const t = rim[0] * e[0] + rim[1] * e[1];
  const neckSurfaceNearRim: PlanePoint = [e[0] * t + nrm[0] * h, e[1] * t + nrm[1] * h];
  const clearance = input.slotted ? null : R * Math.cos(beta) - a * Math.sin(beta) - h;
  const state = clearance !== null ? clearanceState(clearance) : slotState((input.slotLimitDeg ?? 90) - input.betaDeg);
  const slotLine: readonly [PlanePoint, PlanePoint] | null =
    input.slotted && input.slotLimitDeg !== undefined
      ? [[0, 0], [-Math.cos(input.slotLimitDeg * RAD) * length, Math.sin(input.slotLimitDeg * RAD) * length]]
      : null;
  return {
    cupWalls: input.slotted ? [lower, back] : [lower, upper, back],
    neck,
    neckAxis: [[0, 0], end],
    bore,
    rim,
    neckSurfaceNearRim,
    clearanceMm: clearance,
    state,
    slotLine,
    pivotRadiusMm: Math.max(h * 1.15, 0.4),
    wallMm: wall,
    extent: { minU: -length - 1, maxU: depth + wall + 1, minV: -R - wall - 1, maxV: Math.max(R + wall, end[1] + h) + 1 },
  };
}
