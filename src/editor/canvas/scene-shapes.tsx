"use client";
// A scene (src/drawing) on the Konva canvas: the marks src/drawing/screen-scene.ts resolves, the same ones
// the SVG and PDF exports draw. Static drawing: nothing here listens (hit testing is the view frame's job).
import { Circle, Line, Text } from "react-konva";
import type { Scene } from "@/drawing/scene";
import { sceneMarks, type ScreenMark } from "@/drawing/screen-scene";
import type { ViewTransform } from "@/drawing/view-transform";
import { CANVAS_FONT } from "@/drawing/drawing-colours";

function MarkShape({ mark }: { mark: ScreenMark }) {
  switch (mark.kind) {
    case "stroke":
      return (
        <Line
          listening={false}
          points={mark.points.flatMap((p) => [p[0], p[1]])}
          closed={mark.closed}
          stroke={mark.colour}
          strokeWidth={mark.width}
          dash={mark.dash ? [...mark.dash] : undefined}
          fill={mark.fill}
          opacity={mark.opacity}
          lineCap={mark.round ? "round" : "butt"}
          lineJoin={mark.round ? "round" : "miter"}
          perfectDrawEnabled={false}
          shadowForStrokeEnabled={false}
        />
      );
    case "circle":
      return <Circle listening={false} x={mark.at[0]} y={mark.at[1]} radius={mark.radius} fill={mark.fill} stroke={mark.stroke} strokeWidth={mark.width} perfectDrawEnabled={false} />;
    case "text":
      return <Text listening={false} x={mark.at[0]} y={mark.at[1]} width={mark.width} align={mark.align} text={mark.text} fontSize={mark.size} fontFamily={CANVAS_FONT} fontStyle={mark.bold ? "bold" : "normal"} fill={mark.colour} perfectDrawEnabled={false} />;
  }
}

export function SceneShapes({ scene, t, width }: { scene: Scene; t: ViewTransform; width: number }) {
  return (
    <>
      {sceneMarks(scene, t, { left: 0, width }).map((mark, i) => <MarkShape key={`${mark.part}:${i}`} mark={mark} />)}
    </>
  );
}
