// The front view (y–z, seen from ahead) as scene items: arms, knuckle, kingpin axis to the ground, wheel and
// tyre, the drive shaft between its joints; the instant and roll centres as construction; the dimensions.
import type { Layout } from "@/contracts/layout";
import type { CornerPose } from "@/engine";
import { formatLength, type LengthUnit } from "@/figures/length-unit";
import { frontBox, frontDrawing, frontOf } from "./corner-drawing";
import { INK, partColour } from "./drawing-colours";
import { coordinateText } from "./scene-text";
import type { Scene, SceneDetail, SceneItem, SceneShow } from "./scene";
import type { PlanePoint } from "./view-transform";

export interface FrontSceneInput {
  readonly layout: Layout;
  /** The solved corner; null when it cannot be posed (then only the ground and centreline are drawn). */
  readonly pose: CornerPose | null;
  readonly unit: LengthUnit;
  readonly show: SceneShow;
  readonly detail?: SceneDetail;
  /** The part a fault names: drawn in the fault colour. */
  readonly faultPart?: string | null;
  /** The shaft's colour (the editor turns it red where the joint binds). */
  readonly shaftColour?: string;
  /** Draw the layout as laid out, faintly, behind a pose elsewhere. */
  readonly ghost?: boolean;
}

/** Extra dimension text on paper: a point's (y, z) in the chosen unit. */
function pivotLabel(at: PlanePoint, unit: LengthUnit, part: string, dx: number, dy: number): SceneItem {
  return { type: "label", layer: "dimensions", part, at, text: coordinateText(at, unit), colour: INK.label, dxPx: dx, dyPx: dy, sizePx: 9 };
}

export function frontScene(input: FrontSceneInput): Scene {
  const { layout, pose, unit, show } = input;
  const f = layout.frontView;
  const fault = input.faultPart ?? null;
  const items: SceneItem[] = [];
  const d = pose ? frontDrawing(pose, layout) : null;
  const groundZ = d?.groundZ ?? 0;
  items.push({ type: "rule", layer: "construction", part: "ground", v: groundZ, stroke: INK.ground, widthPx: 1.5 });
  items.push({ type: "path", layer: "construction", part: "centreline", points: [[0, -5], [0, Math.max(f.upperInner.z, f.wheelCentre.z + f.tyreRadiusMm) + 10]], stroke: INK.ghost, widthPx: 1, dashPx: [6, 4] });
  items.push({ type: "label", layer: "construction", part: "centreline-label", at: [0, groundZ], text: "centreline", dxPx: 4, dyPx: 4, colour: INK.ground, sizePx: 10 });
  if (input.ghost) {
    const p = (q: { y: number; z: number }) => frontOf([0, q.y, q.z]);
    items.push({ type: "path", layer: "construction", part: "ghost-arms", points: [p(f.lowerInner), p(f.lowerOuter), p(f.upperOuter), p(f.upperInner)], stroke: INK.ghost, widthPx: 1, dashPx: [3, 3] });
    items.push({ type: "path", layer: "construction", part: "ghost-knuckle", points: [p(f.lowerOuter), p(f.wheelCentre), p(f.upperOuter)], stroke: INK.ghost, widthPx: 1, dashPx: [3, 3] });
  }
  if (d) {
    const shaft = partColour(fault, "shaft", input.shaftColour ?? INK.shaft);
    items.push(
      { type: "path", layer: "wheel", part: "tyre", points: d.tyre, closed: true, fill: INK.tyreFill, stroke: partColour(fault, "wheel", INK.tyreStroke), widthPx: 1.5 },
      { type: "band", layer: "shaft-joint", part: "shaft", from: d.shaft[0], to: d.shaft[1], widthMm: layout.drive.neckDiameterMm, colour: shaft, opacity: 0.85 },
      { type: "dot", layer: "shaft-joint", part: "inboard-joint", at: d.shaft[0], radiusPx: 4, fill: INK.shaft },
      { type: "dot", layer: "shaft-joint", part: "outboard-joint", at: d.shaft[1], radiusPx: 4, fill: INK.shaft },
      { type: "path", layer: "arms", part: "lower-arm", points: d.lowerArm, stroke: partColour(fault, "lowerArm", INK.arm), widthPx: 4 },
      { type: "path", layer: "arms", part: "upper-arm", points: d.upperArm, stroke: partColour(fault, "upperArm", INK.arm), widthPx: 4 },
      { type: "path", layer: "knuckle", part: "knuckle", points: d.upright, closed: true, stroke: partColour(fault, "upright", INK.knuckle), widthPx: 3 },
      { type: "dot", layer: "wheel", part: "wheel-centre", at: d.wheelCentre, radiusPx: 3, fill: INK.knuckle },
    );
    if (show.kingpinAxis) {
      items.push(
        { type: "path", layer: "construction", part: "kingpin-axis", points: d.kingpinAxis, stroke: partColour(fault, "kingpin", INK.kingpin), widthPx: 1.5, dashPx: [8, 4] },
        { type: "dot", layer: "construction", part: "kingpin-ground", at: d.kingpinGround, radiusPx: 3, fill: INK.kingpin },
      );
    }
    items.push({ type: "dot", layer: "wheel", part: "contact-patch", at: d.contactPatch, radiusPx: 3, fill: INK.ground });
    const ic = d.instantCentre;
    if (show.instantCentre && ic && Math.abs(ic[0]) < 3000 && Math.abs(ic[1]) < 3000) {
      items.push(
        { type: "path", layer: "construction", part: "lower-arm-line", points: [d.lowerArm[0], ic], stroke: INK.construction, widthPx: 1, dashPx: [4, 4] },
        { type: "path", layer: "construction", part: "upper-arm-line", points: [d.upperArm[0], ic], stroke: INK.construction, widthPx: 1, dashPx: [4, 4] },
        { type: "dot", layer: "construction", part: "instant-centre", at: ic, radiusPx: 3.5, fill: INK.construction },
        { type: "label", layer: "construction", part: "instant-centre-label", at: ic, text: "IC", colour: INK.construction, dxPx: 6, dyPx: -14, sizePx: 11, bold: true },
      );
    }
    if (show.rollCentre && d.rollCentre && ic) {
      items.push(
        { type: "path", layer: "construction", part: "roll-centre-line", points: [d.contactPatch, d.rollCentre], stroke: INK.construction, widthPx: 1, dashPx: [2, 3] },
        { type: "dot", layer: "construction", part: "roll-centre", at: d.rollCentre, radiusPx: 4, fill: "#ffffff", stroke: INK.construction, widthPx: 2 },
        { type: "label", layer: "construction", part: "roll-centre-label", at: d.rollCentre, text: `RC ${formatLength(d.rollCentre[1] - d.groundZ, unit, 1)}`, colour: INK.construction, dxPx: 6, dyPx: -14, sizePx: 11, bold: true },
      );
    }
    if (show.dimensions) {
      items.push(
        { type: "dimension", layer: "dimensions", part: "lower-arm-length", from: d.lowerArm[0], to: d.lowerArm[1], text: formatLength(d.lowerArmLengthMm, unit, 1), offsetPx: 14, colour: INK.label },
        { type: "dimension", layer: "dimensions", part: "upper-arm-length", from: d.upperArm[0], to: d.upperArm[1], text: formatLength(d.upperArmLengthMm, unit, 1), offsetPx: -14, colour: INK.label },
        { type: "dimension", layer: "dimensions", part: "scrub-radius", from: [d.kingpinGround[0], d.groundZ], to: [d.contactPatch[0], d.groundZ], text: `scrub ${formatLength(d.scrubRadiusMm, unit, 1, true)}`, offsetPx: -18, colour: INK.label },
      );
      if (input.detail === "sheet") {
        const shaftMm = Math.hypot(d.shaft[1][0] - d.shaft[0][0], d.shaft[1][1] - d.shaft[0][1]);
        items.push(
          { type: "dimension", layer: "dimensions", part: "shaft-length", from: d.shaft[0], to: d.shaft[1], text: `shaft ${formatLength(shaftMm, unit, 1)}`, offsetPx: -8, offsetMm: -layout.drive.neckDiameterMm / 2, colour: INK.label },
          // Inner points labelled to their left, outer ones to their right, clear of the arms.
          pivotLabel(d.lowerArm[0], unit, "lower-inner-coordinates", -64, -5),
          pivotLabel(d.lowerArm[1], unit, "lower-outer-coordinates", 6, 4),
          pivotLabel(d.upperArm[0], unit, "upper-inner-coordinates", -64, -5),
          pivotLabel(d.upperArm[1], unit, "upper-outer-coordinates", -20, -22),
          pivotLabel(d.wheelCentre, unit, "wheel-centre-coordinates", 8, -4),
          pivotLabel(d.shaft[0], unit, "inboard-joint-coordinates", -64, -5),
        );
      }
    }
  }
  return { view: "front", title: "Front view", axes: "y left →, z up ↑ (seen from ahead)", box: frontBox(layout), items, notes: [] };
}
