import "server-only";
// The three views as one DXF drawing at 1:1 in millimetres, one layer per kind of part, so a designer can
// lay the corner under their CAD model. The front view sits at its own coordinates (y, z) — its points
// are the layout's — the top view (y, −x) below it and the joint section (pivot at its origin) to the
// right, each shifted by a whole offset its title states. Text and dimensions are placed as the canvas
// places them at 4 px per mm (src/drawing/screen-scene.ts), then brought back to millimetres.
import Drawing from "dxf-writer";
import { kitScenes } from "@/drawing/kit-scenes";
import type { Scene, SceneItem, SceneLayer } from "@/drawing/scene";
import { itemMarks, type ScreenFrame, type ScreenMark } from "@/drawing/screen-scene";
import type { ExportKit } from "./export-kit";

/** Screen pixels per millimetre the labels and dimensions are laid out at: text 11 px high is 2.75 mm. */
const PX_PER_MM = 4;
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
const T = { scale: PX_PER_MM, ox: 0, oy: 0 };

/** A mark's screen point back in the plane, mm, moved by the view's offset. */
const mm = (p: readonly [number, number], off: Offset): [number, number] => [p[0] / PX_PER_MM + off[0], -p[1] / PX_PER_MM + off[1]];

function drawMark(dxf: Drawing, m: ScreenMark, off: Offset): void {
  switch (m.kind) {
    case "stroke": {
      const pts = m.points.map((p) => mm(p, off));
      if (pts.length === 2 && !m.closed) dxf.drawLine(pts[0]![0], pts[0]![1], pts[1]![0], pts[1]![1]);
      else dxf.drawPolyline(pts, m.closed);
      return;
    }
    case "circle": {
      const [x, y] = mm(m.at, off);
      dxf.drawCircle(x, y, m.radius / PX_PER_MM);
      return;
    }
    case "text": {
      // A TEXT entity a line, on its baseline a type size below the line's top.
      const w = m.width ?? 0;
      const x = m.align === "center" ? m.at[0] + w / 2 : m.align === "right" ? m.at[0] + w : m.at[0];
      m.text.split("\n").forEach((line, i) => {
        const [px, py] = mm([x, m.at[1] + (i + 1) * m.size], off);
        dxf.drawText(px, py, m.size / PX_PER_MM, 0, line, m.align);
      });
      return;
    }
  }
}

function drawItem(dxf: Drawing, item: SceneItem, off: Offset, frame: ScreenFrame): void {
  dxf.setActiveLayer(dxfLayerName(item.layer));
  if (item.type === "band") {
    // A part drawn to its real width: its outline and its centre line.
    const a = [item.from[0] + off[0], item.from[1] + off[1]];
    const b = [item.to[0] + off[0], item.to[1] + off[1]];
    const len = Math.hypot(b[0]! - a[0]!, b[1]! - a[1]!) || 1;
    const h = item.widthMm / 2;
    const n = [((a[1]! - b[1]!) / len) * h, ((b[0]! - a[0]!) / len) * h];
    dxf.drawPolyline([[a[0]! + n[0]!, a[1]! + n[1]!], [b[0]! + n[0]!, b[1]! + n[1]!], [b[0]! - n[0]!, b[1]! - n[1]!], [a[0]! - n[0]!, a[1]! - n[1]!]], true);
    dxf.drawLine(a[0]!, a[1]!, b[0]!, b[1]!);
    return;
  }
  for (const m of itemMarks(item, T, frame)) drawMark(dxf, m, off);
}

function drawView(dxf: Drawing, scene: Scene, off: Offset): void {
  // Lines across the view reach 10 mm past its box.
  const frame: ScreenFrame = { left: (scene.box.minU - 10) * PX_PER_MM, width: (scene.box.maxU - scene.box.minU + 20) * PX_PER_MM };
  for (const item of scene.items) drawItem(dxf, item, off, frame);
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
