"use client";
// A scene (src/drawing) on the Konva canvas: each item through the plane shape that draws it. Lines across
// the view run from the canvas's left edge to its right, and labels pinned to the start sit at its left edge.
import type { Scene, SceneItem } from "@/drawing/scene";
import type { ViewTransform } from "@/drawing/view-transform";
import { PlaneBand, PlaneDimension, PlaneDot, PlaneLabel, PlaneLine } from "./plane-shapes";

function SceneShape({ item, t, width }: { item: SceneItem; t: ViewTransform; width: number }) {
  const u0 = -t.ox / t.scale;
  switch (item.type) {
    case "path":
      return <PlaneLine t={t} points={item.points} closed={item.closed} stroke={item.stroke} width={item.widthPx} dash={item.dashPx ? [...item.dashPx] : undefined} fill={item.fill} opacity={item.opacity} />;
    case "band":
      return <PlaneBand t={t} from={item.from} to={item.to} widthMm={item.widthMm} colour={item.colour} opacity={item.opacity} />;
    case "dot":
      return <PlaneDot t={t} at={item.at} radiusPx={Math.max(item.radiusPx, (item.radiusMm ?? 0) * t.scale)} fill={item.fill} stroke={item.stroke} width={item.widthPx} />;
    case "label":
      return <PlaneLabel t={t} at={item.pinStart ? [u0, item.at[1]] : item.at} text={item.text} colour={item.colour} dx={item.dxPx} dy={item.dyPx} size={item.sizePx} bold={item.bold} />;
    case "dimension":
      return <PlaneDimension t={t} from={item.from} to={item.to} text={item.text} offsetPx={item.offsetPx + (item.offsetMm ?? 0) * t.scale} colour={item.colour} />;
    case "rule":
      return <PlaneLine t={t} points={[[u0, item.v], [(width - t.ox) / t.scale, item.v]]} stroke={item.stroke} width={item.widthPx} dash={item.dashPx ? [...item.dashPx] : undefined} />;
  }
}

export function SceneShapes({ scene, t, width }: { scene: Scene; t: ViewTransform; width: number }) {
  return (
    <>
      {scene.items.map((item, i) => <SceneShape key={`${item.part}:${i}`} item={item} t={t} width={width} />)}
    </>
  );
}
