"use client";
// A scene (src/drawing) on the Konva canvas: the marks src/drawing/screen-scene.ts resolves, the same ones
// the SVG and PDF exports draw, painted by one shape (scene-canvas.ts). Static drawing: nothing here
// listens (hit testing is the view frame's job).
import { useCallback, useMemo } from "react";
import type { Context } from "konva/lib/Context";
import { Shape } from "react-konva";
import type { Scene } from "@/drawing/scene";
import { sceneMarks } from "@/drawing/screen-scene";
import type { ViewTransform } from "@/drawing/view-transform";
import { CANVAS_FONT } from "@/drawing/drawing-colours";
import { drawMarks } from "./scene-canvas";

export function SceneShapes({ scene, t, width }: { scene: Scene; t: ViewTransform; width: number }) {
  const marks = useMemo(() => sceneMarks(scene, t, { left: 0, width }), [scene, t, width]);
  const draw = useCallback((ctx: Context) => drawMarks(ctx._context, marks, CANVAS_FONT), [marks]);
  return <Shape listening={false} perfectDrawEnabled={false} sceneFunc={draw} />;
}
