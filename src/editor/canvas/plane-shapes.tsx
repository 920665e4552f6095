"use client";
// Konva shapes placed by plane coordinates (mm): each maps its points through the view's transform.
// Everything here is static drawing: listening is off (hit testing is the view frame's job).
import { Circle, Line, Shape, Text } from "react-konva";
import { CANVAS_FONT, INK } from "./drawing-colours";
import { gridSpacingMm, planeToScreen, screenToPlane, type PlanePoint, type ViewTransform } from "./view-transform";

type Stroke = { stroke?: string; width?: number; dash?: number[]; fill?: string; opacity?: number };

const flat = (t: ViewTransform, pts: readonly PlanePoint[]) => pts.flatMap((p) => planeToScreen(t, p) as unknown as number[]);

export function PlaneLine({ t, points, stroke = INK.arm, width = 2, dash, opacity, closed, fill }: { t: ViewTransform; points: readonly PlanePoint[]; closed?: boolean } & Stroke) {
  return <Line listening={false} points={flat(t, points)} stroke={stroke} strokeWidth={width} dash={dash} opacity={opacity} closed={closed} fill={fill} lineCap="round" lineJoin="round" perfectDrawEnabled={false} />;
}

/** A band of the given width in mm along a segment (a shaft drawn to its diameter). */
export function PlaneBand({ t, from, to, widthMm, colour, opacity }: { t: ViewTransform; from: PlanePoint; to: PlanePoint; widthMm: number; colour: string; opacity?: number }) {
  return <Line listening={false} points={flat(t, [from, to])} stroke={colour} strokeWidth={Math.max(1.5, widthMm * t.scale)} opacity={opacity} lineCap="round" perfectDrawEnabled={false} shadowForStrokeEnabled={false} />;
}

export function PlaneDot({ t, at, radiusPx = 3.5, fill = INK.knuckle, stroke, width = 1.5 }: { t: ViewTransform; at: PlanePoint; radiusPx?: number; fill?: string; stroke?: string; width?: number }) {
  const [x, y] = planeToScreen(t, at);
  return <Circle listening={false} x={x} y={y} radius={radiusPx} fill={fill} stroke={stroke} strokeWidth={width} perfectDrawEnabled={false} />;
}

/** A figure at a point, offset by (dx, dy) px; `align="center"` centres it on the offset point. */
export function PlaneLabel({ t, at, text, colour = INK.label, dx = 6, dy = -14, size = 11, bold = false, align = "left" }: { t: ViewTransform; at: PlanePoint; text: string; colour?: string; dx?: number; dy?: number; size?: number; bold?: boolean; align?: "left" | "center" }) {
  const [x, y] = planeToScreen(t, at);
  const box = align === "center" ? { x: x + dx - LABEL_BOX_PX / 2, width: LABEL_BOX_PX, align: "center" as const } : { x: x + dx };
  return <Text listening={false} {...box} y={y + dy} text={text} fontSize={size} fontFamily={CANVAS_FONT} fontStyle={bold ? "bold" : "normal"} fill={colour} perfectDrawEnabled={false} />;
}

/**
 * A dimension: a thin line between two points, offset to one side, with its figure at the middle — or,
 * where that is crowded (inside a small part), centred under the line (`label="under"`) or set past the
 * `from` end (`label="outside-from"`), so it reads clear of the part.
 */
export function PlaneDimension({ t, from, to, text, offsetPx = 0, colour = INK.label, label = "middle" }: { t: ViewTransform; from: PlanePoint; to: PlanePoint; text: string; offsetPx?: number; colour?: string; label?: "middle" | "under" | "outside-from" }) {
  const a = planeToScreen(t, from);
  const b = planeToScreen(t, to);
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len = Math.hypot(dx, dy) || 1;
  const nx = (-dy / len) * offsetPx;
  const ny = (dx / len) * offsetPx;
  const p1 = [a[0] + nx, a[1] + ny];
  const p2 = [b[0] + nx, b[1] + ny];
  const tick = 4;
  const tx = (-dy / len) * tick;
  const ty = (dx / len) * tick;
  const mid = [(p1[0]! + p2[0]!) / 2, (p1[1]! + p2[1]!) / 2] as const;
  const textProps =
    label === "middle" ? { x: mid[0] + 3, y: mid[1] - 13 }
    : label === "under" ? { x: mid[0] - LABEL_BOX_PX / 2, y: Math.max(p1[1]!, p2[1]!) + 4, width: LABEL_BOX_PX, align: "center" as const }
    : outsideLabel(p1[0]!, p1[1]!, -dx / len, -dy / len);
  return (
    <>
      <Line listening={false} points={[p1[0]!, p1[1]!, p2[0]!, p2[1]!]} stroke={colour} strokeWidth={0.75} perfectDrawEnabled={false} />
      <Line listening={false} points={[p1[0]! - tx, p1[1]! - ty, p1[0]! + tx, p1[1]! + ty]} stroke={colour} strokeWidth={0.75} />
      <Line listening={false} points={[p2[0]! - tx, p2[1]! - ty, p2[0]! + tx, p2[1]! + ty]} stroke={colour} strokeWidth={0.75} />
      <Text listening={false} {...textProps} text={text} fontSize={11} fontFamily={CANVAS_FONT} fill={colour} />
    </>
  );
}

/** Width of the box a label set beside a line end is aligned in, px. */
const LABEL_BOX_PX = 160;

/** A label past a line's end (x, y), the line leaving it along −(ax, ay): run on along a level line, or set to the left of an upright one's end. */
function outsideLabel(x: number, y: number, ax: number, ay: number) {
  if (Math.abs(ax) >= Math.abs(ay)) {
    return ax < 0 ? { x: x - 4 - LABEL_BOX_PX, y: y - 6, width: LABEL_BOX_PX, align: "right" as const } : { x: x + 4, y: y - 6 };
  }
  return { x: x - 4 - LABEL_BOX_PX, y: ay > 0 ? y + 2 : y - 14, width: LABEL_BOX_PX, align: "right" as const };
}

/** The millimetre grid of a view (one shape, drawn straight to the canvas), spaced from the snap step. */
export function GridShape({ t, width, height, stepMm }: { t: ViewTransform; width: number; height: number; stepMm: number }) {
  return (
    <Shape
      listening={false}
      perfectDrawEnabled={false}
      sceneFunc={(ctx) => {
        const minor = gridSpacingMm(t.scale, stepMm, 8);
        const major = minor * 5 * (minor * 5 * t.scale < 40 ? 2 : 1);
        const [u0, v1] = screenToPlane(t, [0, 0]);
        const [u1, v0] = screenToPlane(t, [width, height]);
        const lines = (spacing: number, colour: string) => {
          ctx.beginPath();
          for (let u = Math.ceil(u0 / spacing) * spacing; u <= u1; u += spacing) {
            const x = Math.round(u * t.scale + t.ox) + 0.5;
            ctx.moveTo(x, 0);
            ctx.lineTo(x, height);
          }
          for (let v = Math.ceil(v0 / spacing) * spacing; v <= v1; v += spacing) {
            const y = Math.round(-v * t.scale + t.oy) + 0.5;
            ctx.moveTo(0, y);
            ctx.lineTo(width, y);
          }
          ctx.strokeStyle = colour;
          ctx.lineWidth = 1;
          ctx.stroke();
        };
        lines(minor, INK.gridMinor);
        lines(major, INK.gridMajor);
      }}
    />
  );
}
