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

/** Text with its top-left corner at `at`. */
export interface TextMark extends Mark {
  readonly kind: "text";
  readonly at: ScreenPoint;
  readonly text: string;
  readonly size: number;
  readonly bold: boolean;
  readonly colour: string;
}

export type ScreenMark = StrokeMark | CircleMark | TextMark;

/** The screen area the view fills: lines across the view and pinned labels reach its edges. */
export interface ScreenFrame {
  readonly left: number;
  readonly width: number;
}

const TICK_PX = 4;

function marksOf(item: SceneItem, t: ViewTransform, frame: ScreenFrame, k: number): ScreenMark[] {
  const base = { layer: item.layer, part: item.part };
  const on = (p: PlanePoint) => planeToScreen(t, p);
  switch (item.type) {
    case "path":
      return [{ ...base, kind: "stroke", points: item.points.map(on), closed: item.closed ?? false, colour: item.stroke, width: item.widthPx * k, dash: item.dashPx?.map((d) => d * k), fill: item.fill, opacity: item.opacity, round: true }];
    case "band":
      return [{ ...base, kind: "stroke", points: [on(item.from), on(item.to)], closed: false, colour: item.colour, width: Math.max(1.5 * k, item.widthMm * t.scale), opacity: item.opacity, round: true }];
    case "dot":
      return [{ ...base, kind: "circle", at: on(item.at), radius: Math.max(item.radiusPx * k, (item.radiusMm ?? 0) * t.scale), fill: item.fill, stroke: item.stroke, width: item.widthPx !== undefined ? item.widthPx * k : item.stroke ? 1.5 * k : undefined }];
    case "label": {
      const [x, y] = item.pinStart ? [frame.left, on(item.at)[1]] : on(item.at);
      return [{ ...base, kind: "text", at: [x + item.dxPx * k, y + item.dyPx * k], text: item.text, size: item.sizePx * k, bold: item.bold ?? false, colour: item.colour }];
    }
    case "dimension": {
      const a = on(item.from);
      const b = on(item.to);
      const dx = b[0] - a[0];
      const dy = b[1] - a[1];
      const len = Math.hypot(dx, dy) || 1;
      const n: ScreenPoint = [-dy / len, dx / len];
      const off = item.offsetPx * k + (item.offsetMm ?? 0) * t.scale;
      const p1: ScreenPoint = [a[0] + n[0] * off, a[1] + n[1] * off];
      const p2: ScreenPoint = [b[0] + n[0] * off, b[1] + n[1] * off];
      const tick = TICK_PX * k;
      const line = (points: ScreenPoint[]): StrokeMark => ({ ...base, kind: "stroke", points, closed: false, colour: item.colour, width: 0.75 * k, round: false });
      return [
        line([p1, p2]),
        line([[p1[0] - n[0] * tick, p1[1] - n[1] * tick], [p1[0] + n[0] * tick, p1[1] + n[1] * tick]]),
        line([[p2[0] - n[0] * tick, p2[1] - n[1] * tick], [p2[0] + n[0] * tick, p2[1] + n[1] * tick]]),
        { ...base, kind: "text", at: [(p1[0] + p2[0]) / 2 + 3 * k, (p1[1] + p2[1]) / 2 - 13 * k], text: item.text, size: 11 * k, bold: false, colour: item.colour },
      ];
    }
    case "rule": {
      const y = on([0, item.v])[1];
      return [{ ...base, kind: "stroke", points: [[frame.left, y], [frame.left + frame.width, y]], closed: false, colour: item.stroke, width: item.widthPx * k, dash: item.dashPx?.map((d) => d * k), round: true }];
    }
  }
}

/** Every mark of the scene in paint order, through the view transform `t` (plane mm → screen). */
export function sceneMarks(scene: Scene, t: ViewTransform, frame: ScreenFrame, k = 1): ScreenMark[] {
  return scene.items.flatMap((item) => marksOf(item, t, frame, k));
}
