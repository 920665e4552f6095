// A view as a list of drawing items in its plane (mm), in paint order: what the editor's canvas, the SVG,
// the PDF sheet and the DXF all draw, each through its own small renderer. Sizes that are about legibility
// rather than the part (line widths, dot radii, label offsets and type) are in screen pixels; a paper or
// CAD renderer scales them by one factor of its own.
import type { PlaneBox, PlanePoint } from "./view-transform";

/** The kind of part an item belongs to: a DXF layer, an SVG class, and the fault colouring's key. */
export const SCENE_LAYERS = ["arms", "knuckle", "wheel", "shaft-joint", "steering", "construction", "dimensions"] as const;
export type SceneLayer = (typeof SCENE_LAYERS)[number];

interface ItemBase {
  readonly layer: SceneLayer;
  /** What the item draws, in words of our own ("lower-arm", "tyre", "kingpin-axis"): ids in the SVG, tests. */
  readonly part: string;
}

/** A polyline (or polygon when closed). */
export interface ScenePath extends ItemBase {
  readonly type: "path";
  readonly points: readonly PlanePoint[];
  readonly closed?: boolean;
  readonly stroke: string;
  readonly widthPx: number;
  readonly dashPx?: readonly number[];
  readonly fill?: string;
  readonly opacity?: number;
}

/** A straight part drawn to its real width (a shaft to its neck diameter). */
export interface SceneBand extends ItemBase {
  readonly type: "band";
  readonly from: PlanePoint;
  readonly to: PlanePoint;
  readonly widthMm: number;
  readonly colour: string;
  readonly opacity?: number;
}

/** A marked point; `radiusMm`, when given, is the point's real size (drawn no smaller than radiusPx). */
export interface SceneDot extends ItemBase {
  readonly type: "dot";
  readonly at: PlanePoint;
  readonly radiusPx: number;
  readonly radiusMm?: number;
  readonly fill: string;
  readonly stroke?: string;
  readonly widthPx?: number;
}

/**
 * Text beside a point (lines split at "\n"), offset by (dxPx, dyPx) down the screen, plus `dyMm` of the
 * part's own size (−wall: above a wall of that thickness), plus the radius of a dot it is `beside` (so it
 * clears the dot at any zoom). `align: "center"` centres it on the offset point; `pinStart` moves it to the view's left edge.
 */
export interface SceneLabel extends ItemBase {
  readonly type: "label";
  readonly at: PlanePoint;
  readonly text: string;
  readonly colour: string;
  readonly dxPx: number;
  readonly dyPx: number;
  readonly dyMm?: number;
  readonly beside?: { readonly radiusPx: number; readonly radiusMm: number };
  readonly sizePx: number;
  readonly bold?: boolean;
  readonly align?: "left" | "center";
  readonly pinStart?: boolean;
}

/** A dimension: a thin line between two points with end ticks, offset to one side, its figure at the middle. */
export interface SceneDimension extends ItemBase {
  readonly type: "dimension";
  readonly from: PlanePoint;
  readonly to: PlanePoint;
  readonly text: string;
  readonly offsetPx: number;
  /** A further offset in mm, so the line clears a part whatever the zoom (the cup wall). */
  readonly offsetMm?: number;
  readonly colour: string;
  /**
   * Where the figure goes: at the middle, beside the line (default); centred under it; or past the `from`
   * end, where the middle is crowded (inside a small part). An empty text draws the line alone.
   */
  readonly label?: "middle" | "under" | "outside-from";
}

/** A horizontal line at height v across the whole view (the ground, the axle lines). */
export interface SceneRule extends ItemBase {
  readonly type: "rule";
  readonly v: number;
  readonly stroke: string;
  readonly widthPx: number;
  readonly dashPx?: readonly number[];
}

export type SceneItem = ScenePath | SceneBand | SceneDot | SceneLabel | SceneDimension | SceneRule;

export type SceneViewId = "front" | "top" | "joint";

export interface Scene {
  readonly view: SceneViewId;
  readonly title: string;
  /** Which way the plane's axes point, in words. */
  readonly axes: string;
  /** What to frame: the corner as laid out (what "Fit" shows). */
  readonly box: PlaneBox;
  readonly items: readonly SceneItem[];
  /** Sentences that go with the view (what binds, where the wheel axes meet, the joint's state). */
  readonly notes: readonly string[];
}

/** What the views draw besides the parts (the editor's "Show…" choices). */
export interface SceneShow {
  readonly kingpinAxis: boolean;
  readonly instantCentre: boolean;
  readonly rollCentre: boolean;
  readonly ackermann: boolean;
  readonly dimensions: boolean;
}

export const SHOW_ALL: SceneShow = { kingpinAxis: true, instantCentre: true, rollCentre: true, ackermann: true, dimensions: true };

/**
 * How much a view says: "editor" is the canvas; "sheet" adds what a machinist needs on paper (pivot
 * coordinates, shaft length, the bore).
 */
export type SceneDetail = "editor" | "sheet";
