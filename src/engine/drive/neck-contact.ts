/**
 * How far a shaft can articulate in its cup before the neck touches the mouth (REFERENCES §8, derived [D]).
 *
 * Frame: the cup (outdrive) axis; the joint pivot P (ball / barrel-end centre or cross-pin centre) sits on
 * that axis at depth a inside the cup, measured from the mouth plane towards the cup bottom. The neck is a
 * round cylinder through P; the articulation angle β is the tilt of the neck axis from the cup axis, in
 * degrees, 0 = straight. Round bore and round neck: the first contact lies in the plane of articulation,
 * so the plane-section result below is exact in 3-D.
 */
import { GeometryError } from "../errors";
import { DEG_PER_RAD, RAD_PER_DEG, finiteResult, requireFinite, requireNonNegative, requirePositive } from "./guards";

const NECK = "shaft neck";
const CUP = "cup mouth";

/** A plain round cup mouth and the neck that passes through it, all in mm. */
export interface NeckInCup {
  /** Inner diameter D of the cup at its mouth edge, mm, > 0. */
  readonly mouthDiameterMm: number;
  /** Neck diameter d, mm, 0 < d < D. */
  readonly neckDiameterMm: number;
  /** Depth a of the pivot inside the cup, from the mouth plane, mm, ≥ 0. */
  readonly pivotDepthMm: number;
}

/** One edge of a stepped or chamfered mouth: its diameter and how far outboard of the pivot it lies. */
export interface CupRimEdge {
  /** Diameter D_j of this rim edge, mm, > 0. */
  readonly diameterMm: number;
  /** Axial distance a_j from the pivot out to this edge's plane, mm, ≥ 0 (the pivot lies this deep behind it). */
  readonly depthMm: number;
}

/**
 * The cup as the articulation limit sees it:
 * - "plain": one round mouth edge;
 * - "stepped": a chamfered or stepped mouth, every rim edge listed (the smallest angle over them binds);
 * - "slotted": a cup open at the side, where the slot (not the mouth edge) stops the shaft; its angle is given.
 */
export type CupMouth =
  | { readonly kind: "plain"; readonly mouthDiameterMm: number; readonly pivotDepthMm: number }
  | { readonly kind: "stepped"; readonly rimEdges: readonly CupRimEdge[] }
  | { readonly kind: "slotted"; readonly slotAngleDeg: number };

/** The articulation limit of a neck in a cup, and what sets it. */
export interface CupArticulationLimit {
  /** Largest articulation angle before contact, degrees, in (0°, 90°]. */
  readonly limitDeg: number;
  /** "mouth-rim" when a rim edge touches the neck, "slot" when the slot angle binds. */
  readonly limitedBy: "mouth-rim" | "slot";
  /** Index of the binding rim edge (0 for a plain mouth), null for a slotted cup. */
  readonly rimEdgeIndex: number | null;
}

function checkedNeckInCup(p: NeckInCup): { D: number; d: number; a: number } {
  const D = requirePositive(p.mouthDiameterMm, CUP, "mouth diameter");
  const d = requirePositive(p.neckDiameterMm, NECK, "neck diameter");
  const a = requireNonNegative(p.pivotDepthMm, CUP, "pivot depth below the mouth");
  if (d >= D) {
    throw new GeometryError(NECK, `neck diameter ${d} mm is not smaller than the cup mouth ${D} mm: the shaft cannot articulate`);
  }
  return { D, d, a };
}

function contactAngleRad(D: number, d: number, a: number): number {
  // (D/2)cosβ − a sinβ = d/2 written as R cos(β + φ) = d/2 with R = √(D² + 4a²)/2, φ = atan(2a/D).
  const beta = Math.acos(d / Math.hypot(D, 2 * a)) - Math.atan2(2 * a, D);
  return Math.max(0, beta);
}

/**
 * Articulation angle at which the neck first touches the mouth edge, degrees:
 * β_max = arccos(d / √(D² + 4a²)) − atan(2a / D)  (REFERENCES §8.1 [D]).
 * Range (0°, 90°]: 90° only with the pivot in the mouth plane and a vanishing neck; d → 0 gives atan(D / 2a).
 * Throws GeometryError ("shaft neck") when d ≥ D, or for a non-finite, non-positive size or negative depth.
 */
export function neckContactAngleDeg(p: NeckInCup): number {
  const { D, d, a } = checkedNeckInCup(p);
  return contactAngleRad(D, d, a) * DEG_PER_RAD;
}

/**
 * Rate of change of the contact angle with neck diameter, degrees per mm:
 * dβ/dd = −1 / (D sinβ + 2a cosβ) (REFERENCES §8.1 [D]). Always negative: a thinner neck articulates further.
 * Same inputs and errors as neckContactAngleDeg.
 */
export function neckContactSensitivityDegPerMm(p: NeckInCup): number {
  const { D, d, a } = checkedNeckInCup(p);
  const beta = contactAngleRad(D, d, a);
  const perRad = -1 / (D * Math.sin(beta) + 2 * a * Math.cos(beta));
  return finiteResult(perRad * DEG_PER_RAD, NECK, "contact-angle sensitivity");
}

/**
 * Radial gap between the neck surface and the mouth edge at articulation β, mm:
 * (D/2)cosβ − a sinβ − d/2; positive = clear, 0 = touching, negative = the neck would cut into the rim.
 * β in degrees, |β| ≤ 90° (the sign of β is ignored: the bore is round). Same errors as neckContactAngleDeg.
 */
export function neckClearanceMm(p: NeckInCup, betaDeg: number): number {
  const { D, d, a } = checkedNeckInCup(p);
  const beta = Math.abs(requireFinite(betaDeg, NECK, "articulation angle")) * RAD_PER_DEG;
  if (beta > Math.PI / 2) throw new GeometryError(NECK, `articulation angle ${betaDeg}° is beyond ±90°`);
  return (D / 2) * Math.cos(beta) - a * Math.sin(beta) - d / 2;
}

function checkedRimEdges(rimEdges: readonly CupRimEdge[]): readonly CupRimEdge[] {
  if (!Array.isArray(rimEdges) || rimEdges.length === 0) {
    throw new GeometryError(CUP, "a stepped mouth needs at least one rim edge");
  }
  return rimEdges;
}

/**
 * Smallest neck-to-rim gap over all edges of a stepped or chamfered mouth at articulation β, mm
 * (positive = clear). Each edge is a plain mouth with its own diameter and depth; errors as neckClearanceMm.
 */
export function steppedMouthClearanceMm(neckDiameterMm: number, rimEdges: readonly CupRimEdge[], betaDeg: number): number {
  return Math.min(
    ...checkedRimEdges(rimEdges).map((edge) =>
      neckClearanceMm({ mouthDiameterMm: edge.diameterMm, neckDiameterMm, pivotDepthMm: edge.depthMm }, betaDeg),
    ),
  );
}

/**
 * Articulation limit of a neck of diameter d (mm) in a cup, degrees, and what binds:
 * plain mouth → neckContactAngleDeg; stepped mouth → the minimum over its rim edges (REFERENCES §8.1);
 * slotted cup → its slot angle, which must lie in (0°, 90°].
 * Throws GeometryError for a neck not smaller than any rim edge, an empty edge list, or a bad slot angle.
 */
export function cupArticulationLimit(neckDiameterMm: number, cup: CupMouth): CupArticulationLimit {
  if (cup.kind === "slotted") {
    const slot = requirePositive(cup.slotAngleDeg, CUP, "slot angle");
    if (slot > 90) throw new GeometryError(CUP, `slot angle ${slot}° is beyond 90°`);
    requirePositive(neckDiameterMm, NECK, "neck diameter");
    return { limitDeg: slot, limitedBy: "slot", rimEdgeIndex: null };
  }
  const edges: readonly CupRimEdge[] =
    cup.kind === "plain" ? [{ diameterMm: cup.mouthDiameterMm, depthMm: cup.pivotDepthMm }] : checkedRimEdges(cup.rimEdges);
  let limitDeg = Infinity;
  let rimEdgeIndex = 0;
  edges.forEach((edge, index) => {
    const angle = neckContactAngleDeg({ mouthDiameterMm: edge.diameterMm, neckDiameterMm, pivotDepthMm: edge.depthMm });
    if (angle < limitDeg) {
      limitDeg = angle;
      rimEdgeIndex = index;
    }
  });
  return { limitDeg, limitedBy: "mouth-rim", rimEdgeIndex };
}
