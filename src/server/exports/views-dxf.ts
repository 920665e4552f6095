import "server-only";
// The three views as one DXF drawing at 1:1 in millimetres, one layer per kind of part, so a designer can
// lay the corner under their CAD model. The front view sits at its own coordinates (y, z) — its points
// are the layout's — the top view (y, −x) below it and the joint section (pivot at its origin) to the
// right, each shifted by a whole offset its title states.
import Drawing from "dxf-writer";
import type { Scene, SceneItem, SceneLayer } from "@/drawing/scene";
import type { PlanePoint } from "@/drawing/view-transform";
import type { ExportKit } from "./export-kit";
import { kitScenes } from "@/drawing/kit-scenes";

/** Millimetres per screen pixel for what the scenes size in pixels (text, offsets, markers): 0.25 mm. */
const MM_PER_PX = 0.25;
/** Space between the views, mm. */
const GAP_MM = 40;

/** AutoCAD colour index and line type of each layer (our own choice). */
const LAYER_STYLE: Record<SceneLayer, { colour: number; lineType: string }> = {
  arms: { colour: 5, lineType: "CONTINUOUS" },
  knuckle: { colour: 7, lineType: "CONTINUOUS" },
  wheel: { colour: 8, lineType: "CONTINUOUS" },
  "shaft-joint": { colour: 30, lineType: "CONTINUOUS" },
  steering: { colour: 6, lineType: "CONTINUOUS" },
  construction: { colour: 4, lineType: "SHORTDASH" },
  dimensions: { colour: 3, lineType: "CONTINUOUS" },
};

/** The DXF layer of a kind of part. */
export const dxfLayerName = (layer: SceneLayer) => layer.toUpperCase().replace("-", "_");

type Offset = readonly [number, number];

function drawItem(dxf: Drawing, item: SceneItem, off: Offset, span: readonly [number, number]): void {
  const at = (p: PlanePoint): [number, number] => [p[0] + off[0], p[1] + off[1]];
  dxf.setActiveLayer(dxfLayerName(item.layer));
  switch (item.type) {
    case "path": {
      const pts = item.points.map(at);
      if (pts.length === 2 && !item.closed) dxf.drawLine(pts[0]![0], pts[0]![1], pts[1]![0], pts[1]![1]);
      else dxf.drawPolyline(pts, item.closed ?? false);
      return;
    }
    case "band": {
      // The outline at the part's real width, and its centre line.
      const [a, b] = [at(item.from), at(item.to)];
      const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
      const h = item.widthMm / 2;
      const n = [((a[1] - b[1]) / len) * h, ((b[0] - a[0]) / len) * h];
      dxf.drawPolyline([[a[0] + n[0]!, a[1] + n[1]!], [b[0] + n[0]!, b[1] + n[1]!], [b[0] - n[0]!, b[1] - n[1]!], [a[0] - n[0]!, a[1] - n[1]!]], true);
      dxf.drawLine(a[0], a[1], b[0], b[1]);
      return;
    }
    case "dot": {
      const [x, y] = at(item.at);
      dxf.drawCircle(x, y, item.radiusMm ?? item.radiusPx * MM_PER_PX);
      return;
    }
    case "label": {
      // Screen offsets point down; the plane's v points up. DXF text sits on its baseline.
      const [x, y] = at(item.pinStart ? [span[0], item.at[1]] : item.at);
      const height = item.sizePx * MM_PER_PX;
      dxf.drawText(x + item.dxPx * MM_PER_PX, y - item.dyPx * MM_PER_PX - height, height, 0, item.text);
      return;
    }
    case "dimension": {
      const [a, b] = [at(item.from), at(item.to)];
      const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
      const n = [(b[1] - a[1]) / len, -(b[0] - a[0]) / len];
      const o = item.offsetPx * MM_PER_PX + (item.offsetMm ?? 0);
      const p1 = [a[0] + n[0]! * o, a[1] + n[1]! * o];
      const p2 = [b[0] + n[0]! * o, b[1] + n[1]! * o];
      const tick = 4 * MM_PER_PX;
      dxf.drawLine(p1[0]!, p1[1]!, p2[0]!, p2[1]!);
      dxf.drawLine(p1[0]! - n[0]! * tick, p1[1]! - n[1]! * tick, p1[0]! + n[0]! * tick, p1[1]! + n[1]! * tick);
      dxf.drawLine(p2[0]! - n[0]! * tick, p2[1]! - n[1]! * tick, p2[0]! + n[0]! * tick, p2[1]! + n[1]! * tick);
      dxf.drawText((p1[0]! + p2[0]!) / 2 + 3 * MM_PER_PX, (p1[1]! + p2[1]!) / 2 + 2 * MM_PER_PX, 11 * MM_PER_PX, 0, item.text);
      return;
    }
    case "rule": {
      const y = item.v + off[1];
      dxf.drawLine(span[0] + off[0], y, span[1] + off[0], y);
      return;
    }
  }
}

function drawView(dxf: Drawing, scene: Scene, off: Offset): void {
  const span: [number, number] = [scene.box.minU - 10, scene.box.maxU + 10];
  for (const item of scene.items) drawItem(dxf, item, off, span);
  dxf.setActiveLayer(dxfLayerName("dimensions"));
  const origin = off[0] === 0 && off[1] === 0 ? "at its own coordinates" : `origin moved to (${off[0]}, ${off[1]})`;
  dxf.drawText(scene.box.minU + off[0], scene.box.maxV + off[1] + 8, 3, 0, `${scene.title}: ${scene.axes}; mm, ${origin}`);
}

/** The views of the kit at ride height, straight ahead (the joint at its largest angle inside the lock). */
export function viewsDxf(kit: ExportKit): string {
  const scenes = kitScenes(kit.layout, kit.analysis, "mm", "sheet");
  const dxf = new Drawing();
  dxf.setUnits("Millimeters");
  dxf.addLineType("SHORTDASH", "__ __ __", [2, -1.5]);
  for (const [layer, style] of Object.entries(LAYER_STYLE) as [SceneLayer, (typeof LAYER_STYLE)[SceneLayer]][]) {
    dxf.addLayer(dxfLayerName(layer), style.colour, style.lineType);
  }
  const { front, top, joint } = scenes;
  // Whole millimetres, so the offsets are easy to undo in CAD.
  const topOff: Offset = [0, Math.floor(front.box.minV - GAP_MM - top.box.maxV)];
  const jointOff: Offset = [Math.ceil(Math.max(front.box.maxU, top.box.maxU) + GAP_MM - joint.box.minU), 0];
  drawView(dxf, front, [0, 0]);
  drawView(dxf, top, topOff);
  drawView(dxf, joint, jointOff);
  dxf.setActiveLayer(dxfLayerName("dimensions"));
  dxf.drawText(front.box.minU, front.box.maxV + 20, 4, 0, `${kit.meta.kitName} — revision ${kit.meta.revision} — ${kit.meta.workspaceName} — 1:1, millimetres`);
  return dxf.toDxfString();
}
