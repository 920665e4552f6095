"use client";
// The millimetre grid behind a view (one shape, drawn straight to the canvas); the parts themselves are
// drawn from the view's scene (scene-shapes.tsx).
import { Shape } from "react-konva";
import { INK } from "@/drawing/drawing-colours";
import { gridSpacingMm, screenToPlane, type ViewTransform } from "@/drawing/view-transform";

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
