// Where an underlay's picture lands on a view's canvas: the placement (picture px → plane mm, see
// contracts/underlays) composed with the view's transform (plane mm → screen px).
import { imageToPlane, planeToImage, type ImagePt, type UnderlayPlacement } from "@/contracts/underlays";
import { planeToScreen, screenToPlane, type ScreenPoint, type ViewTransform } from "@/drawing/view-transform";

/** Konva Image attributes: its top-left at (x, y), turned clockwise by `rotation` degrees, scaled uniformly. */
export interface PictureAttrs {
  readonly x: number;
  readonly y: number;
  readonly rotation: number;
  readonly scale: number;
}

/**
 * Screen = view(imageToPlane(p)). The plane's v runs up and the screen's y down, so the picture's turn on screen
 * is the placement's turn reversed (clockwise positive, as Konva turns), and its scale is px/mm × mm/px.
 */
export function pictureAttrs(pl: UnderlayPlacement, t: ViewTransform): PictureAttrs {
  const [x, y] = planeToScreen(t, imageToPlane(pl, { x: 0, y: 0 }));
  return { x, y, rotation: -pl.rotationDeg, scale: t.scale * pl.mmPerPx };
}

/** The picture pixel under a screen point. */
export function screenToPicture(pl: UnderlayPlacement, t: ViewTransform, s: ScreenPoint): ImagePt {
  return planeToImage(pl, screenToPlane(t, s));
}

/** The screen point of a picture pixel. */
export function pictureToScreen(pl: UnderlayPlacement, t: ViewTransform, p: ImagePt): ScreenPoint {
  return planeToScreen(t, imageToPlane(pl, p));
}

/** How a view names its plane's axes, and how its (u, v) relate to the car's coordinates. */
export const VIEW_AXES = {
  front: { u: "y", v: "z", toPlane: (a: number, b: number): [number, number] => [a, b], fromPlane: (u: number, v: number): [number, number] => [u, v] },
  // The top view draws forward down the screen: v = −x.
  top: { u: "y", v: "x", toPlane: (a: number, b: number): [number, number] => [a, -b], fromPlane: (u: number, v: number): [number, number] => [u, -v] },
} as const;
