// A scene placed on a screen or a page: every item resolved to strokes, circles and text in screen units
// (y down), so the canvas, the SVG and the PDF draw exactly the same marks. `k` scales the legibility sizes
// given in pixels (1 on screen; a page uses its own points per pixel).
import type { Scene, SceneItem, SceneLayer } from "./scene";
import { planeToScreen, type PlanePoint, type ScreenPoint, type ViewTransform } from "./view-transform";

interface Mark {
  readonly layer: SceneLayer;
  readonly part: string;
}

export interface StrokeMark extends Mark {
  readonly kind: "stroke";
  readonly points: readonly ScreenPoint[];
  readonly closed: boolean;
  readonly colour: string;
  readonly width: number;
  readonly dash?: readonly number[];
  readonly fill?: string;
  readonly opacity?: number;
  /** Round ends and joins (parts), or square cut (dimension lines and ticks). */
  readonly round: boolean;
}

export interface CircleMark extends Mark {
  readonly kind: "circle";
  readonly at: ScreenPoint;
  readonly radius: number;
  readonly fill: string;
  readonly stroke?: string;
  readonly width?: number;
}

/**
 * Text with its top-left corner at `at`, one line per "\n" (each `size` high). With a `width` the text
 * is aligned in a box of that width starting at `at`.
 */
export interface TextMark extends Mark {
  readonly kind: "text";
  readonly at: ScreenPoint;
  readonly text: string;
  readonly size: number;
  readonly bold: boolean;
  readonly colour: string;
  readonly align: "left" | "center" | "right";
  readonly width?: number;
}

export type ScreenMark = StrokeMark | CircleMark | TextMark;

/** The screen area the view fills: lines across the view and pinned labels reach its edges. */
export interface ScreenFrame {
  readonly left: number;
  readonly width: number;
}

const TICK_PX = 4;
/** Width of the box a centred or right-aligned label is set in, px. */
const LABEL_BOX_PX = 160;

// Module-level helpers rather than closures per item: this runs for every view on every frame of a drag.
function pointsOn(t: ViewTransform, points: readonly PlanePoint[]): ScreenPoint[] {
  const out: ScreenPoint[] = new Array(points.length);
  for (let i = 0; i < points.length; i++) out[i] = planeToScreen(t, points[i]!);
  return out;
}

function scaled(dash: readonly number[] | undefined, k: number): number[] | undefined {
  if (!dash) return undefined;
  const out: number[] = new Array(dash.length);
  for (let i = 0; i < dash.length; i++) out[i] = dash[i]! * k;
  return out;
}

/** Where a dimension's figure goes, in screen units (see SceneDimension.label). */
function dimensionText(item: SceneItem & { type: "dimension" }, p1: ScreenPoint, p2: ScreenPoint, ux: number, uy: number, k: number): Pick<TextMark, "at" | "align" | "width"> {
  const mid: ScreenPoint = [(p1[0] + p2[0]) / 2, (p1[1] + p2[1]) / 2];
  const box = LABEL_BOX_PX * k;
  if (item.label === "under") return { at: [mid[0] - box / 2, Math.max(p1[1], p2[1]) + 4 * k], align: "center", width: box };
  if (item.label === "outside-from") {
    // Past the `from` end, the line leaving it along (ux, uy): on along a level line, or left of an upright one.
    const [x, y] = p1;
    if (Math.abs(ux) >= Math.abs(uy)) return ux > 0 ? { at: [x - 4 * k - box, y - 6 * k], align: "right", width: box } : { at: [x + 4 * k, y - 6 * k], align: "left" };
    return { at: [x - 4 * k - box, uy < 0 ? y + 2 * k : y - 14 * k], align: "right", width: box };
  }
  return { at: [mid[0] + 3 * k, mid[1] - 13 * k], align: "left" };
}

function dimensionMarks(item: SceneItem & { type: "dimension" }, t: ViewTransform, k: number): ScreenMark[] {
  const a = planeToScreen(t, item.from);
  const b = planeToScreen(t, item.to);
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len = Math.hypot(dx, dy) || 1;
  const nx = -dy / len;
  const ny = dx / len;
  const off = item.offsetPx * k + (item.offsetMm ?? 0) * t.scale;
  const p1: ScreenPoint = [a[0] + nx * off, a[1] + ny * off];
  const p2: ScreenPoint = [b[0] + nx * off, b[1] + ny * off];
  const tick = TICK_PX * k;
  const stroke = (points: ScreenPoint[]): StrokeMark => ({ layer: item.layer, part: item.part, kind: "stroke", points, closed: false, colour: item.colour, width: 0.75 * k, round: false });
  const marks: ScreenMark[] = [
    stroke([p1, p2]),
    stroke([[p1[0] - nx * tick, p1[1] - ny * tick], [p1[0] + nx * tick, p1[1] + ny * tick]]),
    stroke([[p2[0] - nx * tick, p2[1] - ny * tick], [p2[0] + nx * tick, p2[1] + ny * tick]]),
  ];
  if (item.text) marks.push({ layer: item.layer, part: item.part, kind: "text", ...dimensionText(item, p1, p2, dx / len, dy / len, k), text: item.text, size: 11 * k, bold: false, colour: item.colour });
  return marks;
}

function markOf(item: Exclude<SceneItem, { type: "dimension" }>, t: ViewTransform, frame: ScreenFrame, k: number): ScreenMark {
  const layer = item.layer;
  const part = item.part;
  switch (item.type) {
    case "path":
      return { layer, part, kind: "stroke", points: pointsOn(t, item.points), closed: item.closed ?? false, colour: item.stroke, width: item.widthPx * k, dash: scaled(item.dashPx, k), fill: item.fill, opacity: item.opacity, round: true };
    case "band":
      return { layer, part, kind: "stroke", points: [planeToScreen(t, item.from), planeToScreen(t, item.to)], closed: false, colour: item.colour, width: Math.max(1.5 * k, item.widthMm * t.scale), opacity: item.opacity, round: true };
    case "dot":
      return { layer, part, kind: "circle", at: planeToScreen(t, item.at), radius: Math.max(item.radiusPx * k, (item.radiusMm ?? 0) * t.scale), fill: item.fill, stroke: item.stroke, width: item.widthPx !== undefined ? item.widthPx * k : item.stroke ? 1.5 * k : undefined };
    case "label": {
      const at = planeToScreen(t, item.at);
      const dx = item.dxPx * k + (item.beside ? Math.max(item.beside.radiusPx * k, item.beside.radiusMm * t.scale) : 0);
      const x = (item.pinStart ? frame.left : at[0]) + dx;
      const y = at[1] + item.dyPx * k + (item.dyMm ?? 0) * t.scale;
      const text = { layer, part, kind: "text" as const, text: item.text, size: item.sizePx * k, bold: item.bold ?? false, colour: item.colour };
      if (item.align === "center") return { ...text, at: [x - (LABEL_BOX_PX * k) / 2, y], align: "center", width: LABEL_BOX_PX * k };
      return { ...text, at: [x, y], align: "left" };
    }
    case "rule": {
      const y = -item.v * t.scale + t.oy;
      return { layer, part, kind: "stroke", points: [[frame.left, y], [frame.left + frame.width, y]], closed: false, colour: item.stroke, width: item.widthPx * k, dash: scaled(item.dashPx, k), round: true };
    }
  }
}

/** The marks of one item, through the view transform `t` (plane mm → screen). */
export function itemMarks(item: SceneItem, t: ViewTransform, frame: ScreenFrame, k = 1): ScreenMark[] {
  return item.type === "dimension" ? dimensionMarks(item, t, k) : [markOf(item, t, frame, k)];
}

/** Every mark of the scene in paint order, through the view transform `t` (plane mm → screen). */
export function sceneMarks(scene: Scene, t: ViewTransform, frame: ScreenFrame, k = 1): ScreenMark[] {
  const marks: ScreenMark[] = [];
  for (const item of scene.items) {
    if (item.type === "dimension") marks.push(...dimensionMarks(item, t, k));
    else marks.push(markOf(item, t, frame, k));
  }
  return marks;
}
