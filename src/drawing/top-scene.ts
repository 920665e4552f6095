// The top view (x–y, seen from above, drawn in line with the front view so y runs the same way; forward is
// down) as scene items: both front wheels at the pose's steer, steering arms, tie rods and the rack, the
// shafts, and the turning construction (the wheel axes, where they meet, and the rear axle line).
import type { Layout } from "@/contracts/layout";
import type { CornerPose } from "@/engine";
import { fmt } from "@/figures/format";
import { formatLength, type LengthUnit } from "@/figures/length-unit";
import { topBox, topDrawing, topOf, type TopDrawing, type TopWheelDrawing } from "./corner-drawing";
import { INK, partColour } from "./drawing-colours";
import { coordinateText } from "./scene-text";
import type { Scene, SceneDetail, SceneItem, SceneShow } from "./scene";

export interface TopSceneInput {
  readonly layout: Layout;
  readonly pose: CornerPose | null;
  readonly unit: LengthUnit;
  readonly show: SceneShow;
  readonly detail?: SceneDetail;
  readonly faultPart?: string | null;
  readonly shaftColour?: string;
  readonly ghost?: boolean;
}

function wheelItems(side: "left" | "right", w: TopWheelDrawing, neckMm: number, fault: string | null, shaftColour: string): SceneItem[] {
  const p = (name: string) => `${side}-${name}`;
  return [
    { type: "path", layer: "wheel", part: p("tyre"), points: w.tyre, closed: true, fill: INK.tyreFill, stroke: partColour(fault, "wheel", INK.tyreStroke), widthPx: 1.5 },
    { type: "band", layer: "shaft-joint", part: p("shaft"), from: w.shaft[0], to: w.shaft[1], widthMm: neckMm, colour: partColour(fault, "shaft", shaftColour), opacity: 0.85 },
    { type: "path", layer: "knuckle", part: p("stub-axle"), points: [w.kingpinGround, w.wheelCentre], stroke: INK.knuckle, widthPx: 3 },
    { type: "path", layer: "steering", part: p("steering-arm"), points: w.steeringArm, stroke: partColour(fault, "steeringArm", INK.knuckle), widthPx: 3 },
    { type: "path", layer: "steering", part: p("tie-rod"), points: w.tieRod, stroke: partColour(fault, "tieRod", INK.arm), widthPx: 2.5 },
    { type: "dot", layer: "construction", part: p("kingpin-ground"), at: w.kingpinGround, radiusPx: 3, fill: INK.kingpin },
    { type: "dot", layer: "wheel", part: p("contact-patch"), at: w.contactPatch, radiusPx: 2.5, fill: INK.ground },
  ];
}

/** Where the wheel axes meet, in words, with the inner and outer road-wheel angles. */
function turnNote(d: TopDrawing, unit: LengthUnit): string {
  const ahead = d.turnCentreAheadOfRearAxleMm;
  if (ahead === null) return "Wheel axes parallel (straight ahead)";
  const l = Math.abs(d.left.roadWheelDeg);
  const r = Math.abs(d.right.roadWheelDeg);
  return `Wheel axes meet ${formatLength(Math.abs(ahead), unit, 1)} ${ahead >= 0 ? "ahead of" : "behind"} the rear axle line · inner ${fmt(Math.max(l, r), 1, "°")}, outer ${fmt(Math.min(l, r), 1, "°")}`;
}

export function topScene(input: TopSceneInput): Scene {
  const { layout, pose, unit, show } = input;
  const fault = input.faultPart ?? null;
  const L = layout.topView.wheelbaseMm;
  const items: SceneItem[] = [
    { type: "path", layer: "construction", part: "centreline", points: [[0, -layout.frontView.tyreRadiusMm * 2], [0, L + 10]], stroke: INK.ghost, widthPx: 1, dashPx: [6, 4] },
    { type: "rule", layer: "construction", part: "front-axle-line", v: 0, stroke: INK.ghost, widthPx: 1, dashPx: [2, 4] },
    { type: "label", layer: "construction", part: "front-axle-label", at: [0, 0], text: "front axle line", dxPx: 4, dyPx: 4, colour: INK.ground, sizePx: 10 },
  ];
  if (show.ackermann) {
    items.push(
      { type: "rule", layer: "construction", part: "rear-axle-line", v: L, stroke: INK.construction, widthPx: 1.5 },
      { type: "label", layer: "construction", part: "rear-axle-label", at: [0, L], pinStart: true, text: "rear axle line", dxPx: 4, dyPx: 2, colour: INK.construction, sizePx: 10 },
    );
  }
  if (input.ghost) {
    const tv = layout.topView;
    items.push({ type: "path", layer: "construction", part: "ghost-steering", points: [topOf([tv.rackEnd.x, tv.rackEnd.y, 0]), topOf([tv.steeringArmBall.x, tv.steeringArmBall.y, 0]), topOf([0, layout.frontView.wheelCentre.y, 0])], stroke: INK.ghost, widthPx: 1, dashPx: [3, 3] });
  }
  const notes: string[] = [];
  if (pose) {
    const d = topDrawing(pose, layout);
    if (show.ackermann && d.turnCentre) {
      items.push(
        { type: "path", layer: "construction", part: "left-wheel-axis", points: [d.left.wheelCentre, d.turnCentre], stroke: INK.construction, widthPx: 1, dashPx: [5, 4] },
        { type: "path", layer: "construction", part: "right-wheel-axis", points: [d.right.wheelCentre, d.turnCentre], stroke: INK.construction, widthPx: 1, dashPx: [5, 4] },
        { type: "dot", layer: "construction", part: "turn-centre", at: d.turnCentre, radiusPx: 4, fill: "#ffffff", stroke: INK.construction, widthPx: 2 },
      );
    }
    items.push({ type: "path", layer: "steering", part: "rack", points: d.rack, stroke: partColour(fault, "tieRod", INK.arm), widthPx: 5, opacity: 0.6 });
    items.push(...wheelItems("left", d.left, layout.drive.neckDiameterMm, fault, input.shaftColour ?? INK.shaft));
    items.push(...wheelItems("right", d.right, layout.drive.neckDiameterMm, null, INK.shaft));
    if (show.dimensions) {
      items.push(
        // The figures go ahead of the tyre, where the drawing is empty: beside the small parts they would
        // cover the linkage or run off the view.
        { type: "dimension", layer: "dimensions", part: "caster-trail", from: d.left.kingpinGround, to: [d.left.contactPatch[0], d.left.kingpinGround[1]], text: "", offsetPx: 16, colour: INK.label },
        { type: "dimension", layer: "dimensions", part: "steering-arm-length", from: d.left.steeringArm[0], to: d.left.steeringArm[1], text: "", offsetPx: -14, colour: INK.label },
        { type: "label", layer: "dimensions", part: "arm-and-trail", at: [d.left.wheelCentre[0], -layout.frontView.tyreRadiusMm], text: `arm ${formatLength(d.steeringArmLengthMm, unit, 1)}\ntrail ${formatLength(d.trailMm, unit, 1, true)}`, dxPx: 0, dyPx: 6, sizePx: 11, align: "center", colour: INK.label },
        { type: "label", layer: "dimensions", part: "left-road-wheel-angle", at: d.left.wheelCentre, text: fmt(d.left.roadWheelDeg, 1, "°"), dxPx: 8, dyPx: -20, sizePx: 11, bold: true, colour: INK.label },
        { type: "label", layer: "dimensions", part: "right-road-wheel-angle", at: d.right.wheelCentre, text: fmt(d.right.roadWheelDeg, 1, "°"), dxPx: -36, dyPx: -20, sizePx: 11, bold: true, colour: INK.label },
      );
      if (input.detail === "sheet") {
        // The steering points as (x, y), the way the layout states them (the plane's v is −x).
        const xy = (p: readonly [number, number]) => coordinateText([-p[1], p[0]], unit);
        items.push(
          { type: "label", layer: "dimensions", part: "steering-arm-ball-coordinates", at: d.left.steeringArm[1], text: `ball ${xy(d.left.steeringArm[1])}`, dxPx: 6, dyPx: 4, sizePx: 9, colour: INK.label },
          { type: "label", layer: "dimensions", part: "rack-end-coordinates", at: d.left.tieRod[1], text: `rack end ${xy(d.left.tieRod[1])}`, dxPx: -20, dyPx: 6, sizePx: 9, colour: INK.label },
        );
      }
    }
    if (show.ackermann) notes.push(turnNote(d, unit));
  }
  return { view: "top", title: "Top view", axes: "y left →, x forward ↓ (seen from above)", box: topBox(layout), items, notes };
}
