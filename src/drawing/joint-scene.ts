// The joint section as scene items: the neck in its cup at one articulation, coloured by clearance, with
// the contact point and the gap figured on the drawing, and the cup's dimensions.
import type { Layout } from "@/contracts/layout";
import { fmt, limitLabel } from "@/figures/format";
import { formatLength, type LengthUnit } from "@/figures/length-unit";
import { CLEARANCE_COLOUR, CLEARANCE_LABEL, INK } from "./drawing-colours";
import { jointSection, type ClearanceState } from "./joint-section-geometry";
import type { Scene, SceneDetail, SceneItem } from "./scene";

export interface JointSceneInput {
  readonly layout: Layout;
  /** Articulation drawn, degrees (≥ 0). */
  readonly betaDeg: number;
  /** Whose joint it is, for the words; null when the drawing stands for either (a sheet's worst case). */
  readonly wheel: "left" | "right" | null;
  readonly unit: LengthUnit;
  readonly showDimensions: boolean;
  /** The joint's limit and what sets it, from the analysis; null before there is one. */
  readonly limit: { readonly deg: number; readonly by: string } | null;
  readonly detail?: SceneDetail;
}

export interface JointScene extends Scene {
  /** Clear, close or touching (touching too when the neck is wider than the mouth). */
  readonly state: ClearanceState;
  readonly colour: string;
  /** The joint's state in one sentence, and its limit. */
  readonly summary: string;
  readonly limitText: string | null;
}

export function jointScene(input: JointSceneInput): JointScene {
  const { layout, betaDeg: beta, unit } = input;
  const d = layout.drive;
  const valid = d.neckDiameterMm < d.cupMouthDiameterMm;
  const section = jointSection({ mouthDiameterMm: d.cupMouthDiameterMm, pivotDepthMm: d.pivotDepthMm, neckDiameterMm: Math.min(d.neckDiameterMm, d.cupMouthDiameterMm), boreDiameterMm: d.boreDiameterMm, betaDeg: beta, slotted: d.slottedCup, slotLimitDeg: d.slotLimitDeg });
  const state: ClearanceState = valid ? section.state : "touching";
  const colour = CLEARANCE_COLOUR[state];
  const words = valid ? CLEARANCE_LABEL[section.state] : "wider than the mouth";
  const at = `${input.wheel ? `${input.wheel} wheel, joint` : "Joint"} at ${fmt(beta, 1, "°")}`;
  const summary = section.clearanceMm !== null
    ? `${at}: neck ${words}, gap ${formatLength(section.clearanceMm, unit, 2)}`
    : `${at}: slot ${words}, ${fmt((d.slotLimitDeg ?? 0) - beta, 1, "°")} to the slot end`;
  const limitText = input.limit ? `limit ${fmt(input.limit.deg, 1, "°")} (${limitLabel(input.limit.by)})` : null;
  const e = section.extent;
  const items: SceneItem[] = [
    { type: "path", layer: "construction", part: "cup-axis", points: [[e.minU, 0], [e.maxU, 0]], stroke: INK.ghost, widthPx: 1, dashPx: [6, 4] },
    ...section.cupWalls.map((wall, i): SceneItem => ({ type: "path", layer: "shaft-joint", part: `cup-wall-${i + 1}`, points: wall, closed: true, fill: "#cbd5e1", stroke: colour, widthPx: 1.5 })),
    { type: "path", layer: "shaft-joint", part: "neck", points: section.neck, closed: true, fill: colour, stroke: colour, widthPx: 1, opacity: 0.55 },
  ];
  if (section.bore) items.push({ type: "path", layer: "shaft-joint", part: "bore", points: section.bore, closed: true, fill: "#ffffff", stroke: colour, widthPx: 1 });
  items.push({ type: "path", layer: "construction", part: "neck-axis", points: section.neckAxis, stroke: INK.knuckle, widthPx: 1, dashPx: [4, 3] });
  if (section.slotLine) items.push({ type: "path", layer: "construction", part: "slot-end", points: section.slotLine, stroke: INK.fault, widthPx: 1.5, dashPx: [6, 3] });
  items.push({ type: "dot", layer: "shaft-joint", part: "joint-pivot", at: [0, 0], radiusPx: 3, radiusMm: section.pivotRadiusMm, fill: INK.shaft });
  if (section.clearanceMm !== null) {
    items.push(
      { type: "path", layer: "dimensions", part: "gap", points: [section.rim, section.neckSurfaceNearRim], stroke: colour, widthPx: 2 },
      { type: "dot", layer: "shaft-joint", part: "mouth-rim", at: section.rim, radiusPx: 3.5, fill: colour },
      { type: "label", layer: "dimensions", part: "gap-label", at: section.rim, text: `gap ${formatLength(section.clearanceMm, unit, 2)}`, colour, dxPx: 6, dyPx: -16, dyMm: -section.wallMm, sizePx: 11, bold: true },
    );
  }
  if (input.showDimensions) {
    const R = d.cupMouthDiameterMm / 2;
    // Clear of the part: the mouth just outside its plane with its figure under the cup's corner, the
    // pivot depth under the lower wall, β inside the cup beside the pivot.
    items.push(
      { type: "dimension", layer: "dimensions", part: "cup-mouth", from: [-d.pivotDepthMm, -R], to: [-d.pivotDepthMm, R], text: `mouth ⌀${formatLength(d.cupMouthDiameterMm, unit, 2)}`, offsetPx: -10, label: "outside-from", colour: INK.label },
      { type: "dimension", layer: "dimensions", part: "pivot-depth", from: [0, -R], to: [-d.pivotDepthMm, -R], text: `pivot depth ${formatLength(d.pivotDepthMm, unit, 2)}`, offsetPx: -8, offsetMm: -section.wallMm, label: "under", colour: INK.label },
      { type: "label", layer: "dimensions", part: "neck-label", at: section.neckAxis[1], text: `neck ⌀${formatLength(d.neckDiameterMm, unit, 2)}`, dxPx: -20, dyPx: -24, sizePx: 11, colour: INK.label },
      { type: "label", layer: "dimensions", part: "beta-label", at: [0, 0], text: `β ${fmt(beta, 1, "°")}`, dxPx: 4, dyPx: -5, beside: { radiusPx: 3, radiusMm: section.pivotRadiusMm }, sizePx: 11, bold: true, colour: INK.label },
    );
    if (input.detail === "sheet" && d.boreDiameterMm) {
      items.push({ type: "label", layer: "dimensions", part: "bore-label", at: section.neckAxis[1], text: `bore ⌀${formatLength(d.boreDiameterMm, unit, 2)}`, dxPx: -20, dyPx: -12, sizePx: 11, colour: INK.label });
    }
  }
  const box = { ...e, maxV: Math.max(e.maxV, d.cupMouthDiameterMm * 1.4) };
  return { view: "joint", title: "Joint section", axes: "through the plane of articulation", box, items, notes: limitText ? [summary, limitText] : [summary], state, colour, summary, limitText };
}
