import { z } from "zod";
import type { AttachmentInfo } from "./attachments";
import { PG_INTEGER_MAX } from "./text";

// A reference underlay: a photo or drawing under the front or top view, placed on the view's plane (mm, u to
// the right, v up) by a similarity: image pixel p (x right, y down) sits at
//   plane(p) = anchorMm + mmPerPx · R(rotationDeg) · (p.x − anchorPx.x, −(p.y − anchorPx.y)).
// Scaling by two picked points a known distance apart sets mmPerPx = distance / |b − a| (and, when asked,
// the turn that levels a→b); the anchor keeps the picture where it was.

export const UNDERLAY_VIEWS = ["front", "top"] as const;
export type UnderlayView = (typeof UNDERLAY_VIEWS)[number];
export const UNDERLAY_VIEW_LABELS: Record<UnderlayView, string> = { front: "Front view", top: "Top view" };

const finite = (field: string, min: number, max: number) =>
  z.number({ error: `${field} must be a number` }).min(min, { error: `${field} must be at least ${min}` }).max(max, { error: `${field} must be at most ${max}` });
const pixel = (field: string) => z.strictObject({ x: finite(`${field}.x`, -100_000, 100_000), y: finite(`${field}.y`, -100_000, 100_000) });

export const underlayPlacementSchema = z.strictObject({
  anchorPx: pixel("placement.anchorPx"),
  anchorMm: z.strictObject({ u: finite("placement.anchorMm.u", -10_000, 10_000), v: finite("placement.anchorMm.v", -10_000, 10_000) }),
  mmPerPx: finite("placement.mmPerPx", 0.0001, 100),
  rotationDeg: finite("placement.rotationDeg", -360, 360),
  /** The two points picked on the picture and the distance between them, once it was scaled by them. */
  picks: z
    .strictObject({ aPx: pixel("placement.picks.aPx"), bPx: pixel("placement.picks.bPx"), distanceMm: finite("placement.picks.distanceMm", 0.01, 10_000) })
    .refine((p) => Math.hypot(p.bPx.x - p.aPx.x, p.bPx.y - p.aPx.y) >= 1, { error: "placement.picks: the two points must be at least a pixel apart" })
    .nullable(),
});
export type UnderlayPlacement = z.infer<typeof underlayPlacementSchema>;

const opacity = z.number({ error: "opacity must be a number" }).min(0.05, { error: "opacity must be at least 0.05" }).max(1, { error: "opacity must be at most 1" });

/** PATCH …/underlays/{view} */
export const underlayPatchBody = z
  .strictObject({
    version: z.number({ error: "version must be a number" }).int().min(1).max(PG_INTEGER_MAX - 1),
    placement: underlayPlacementSchema.optional(),
    opacity: opacity.optional(),
    visible: z.boolean({ error: "visible must be true or false" }).optional(),
  })
  .refine((b) => b.placement !== undefined || b.opacity !== undefined || b.visible !== undefined, { error: "Send placement, opacity or visible to change", path: ["placement"] });

export interface Underlay {
  readonly id: string;
  readonly view: UnderlayView;
  readonly file: AttachmentInfo;
  readonly placement: UnderlayPlacement;
  readonly opacity: number;
  readonly visible: boolean;
  readonly version: number;
  readonly updatedAt: string;
}

export type PlanePt = readonly [number, number];
export type ImagePt = { readonly x: number; readonly y: number };

const rad = (deg: number) => (deg * Math.PI) / 180;

/** Where image pixel `p` lies on the view's plane, mm. */
export function imageToPlane(pl: UnderlayPlacement, p: ImagePt): PlanePt {
  const dx = p.x - pl.anchorPx.x;
  const dy = -(p.y - pl.anchorPx.y);
  const c = Math.cos(rad(pl.rotationDeg));
  const s = Math.sin(rad(pl.rotationDeg));
  return [pl.anchorMm.u + pl.mmPerPx * (c * dx - s * dy), pl.anchorMm.v + pl.mmPerPx * (s * dx + c * dy)];
}

/** The image pixel under plane point `q` (the inverse of imageToPlane). */
export function planeToImage(pl: UnderlayPlacement, q: PlanePt): ImagePt {
  const du = (q[0] - pl.anchorMm.u) / pl.mmPerPx;
  const dv = (q[1] - pl.anchorMm.v) / pl.mmPerPx;
  const c = Math.cos(rad(pl.rotationDeg));
  const s = Math.sin(rad(pl.rotationDeg));
  return { x: pl.anchorPx.x + c * du + s * dv, y: pl.anchorPx.y - (-s * du + c * dv) };
}

/** A first placement: the picture centred on `centreMm`, `widthMm` wide, unturned, not yet to scale. */
export function initialPlacement(image: { width: number; height: number }, centreMm: PlanePt, widthMm: number): UnderlayPlacement {
  return {
    anchorPx: { x: image.width / 2, y: image.height / 2 },
    anchorMm: { u: centreMm[0], v: centreMm[1] },
    mmPerPx: Math.min(100, Math.max(0.0001, widthMm / Math.max(image.width, 1))),
    rotationDeg: 0,
    picks: null,
  };
}

/**
 * The placement after picking `a` and `b` on the picture `distanceMm` apart: to scale, turned so a→b runs
 * along +u when `level` (else the turn is kept), with `a` left where it was on the plane (or put at `aAtMm`).
 */
export function placeByPicks(pl: UnderlayPlacement, a: ImagePt, b: ImagePt, distanceMm: number, opts: { level?: boolean; aAtMm?: PlanePt } = {}): UnderlayPlacement {
  const lengthPx = Math.hypot(b.x - a.x, b.y - a.y);
  const aOnPlane = opts.aAtMm ?? imageToPlane(pl, a);
  // The picture's own direction of a→b with y flipped up, degrees.
  const imageDeg = (Math.atan2(-(b.y - a.y), b.x - a.x) * 180) / Math.PI;
  let rotationDeg = opts.level ? -imageDeg : pl.rotationDeg;
  if (rotationDeg > 180) rotationDeg -= 360;
  if (rotationDeg <= -180) rotationDeg += 360;
  return {
    anchorPx: { x: a.x, y: a.y },
    anchorMm: { u: aOnPlane[0], v: aOnPlane[1] },
    mmPerPx: distanceMm / lengthPx,
    rotationDeg,
    picks: { aPx: { x: a.x, y: a.y }, bPx: { x: b.x, y: b.y }, distanceMm },
  };
}

/** The placement moved by (du, dv) mm on the plane. */
export function movedPlacement(pl: UnderlayPlacement, du: number, dv: number): UnderlayPlacement {
  return { ...pl, anchorMm: { u: pl.anchorMm.u + du, v: pl.anchorMm.v + dv } };
}
