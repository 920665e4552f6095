// What is wrong with a layout, pointed at the part of the drawing to blame: from a layout field's path
// (a range or a check between fields) or from the engine's GeometryError part name.
import type { LayoutIssue } from "@/contracts/layout";
import type { PartId } from "../document/handles";
import { layoutMessageInWords } from "@/figures/layout-fields";
import { HANDLES } from "../document/handles";
import type { LayoutFault } from "../store/editor-store";

// The engine's part names (src/engine: GeometryError(part, reason)) → the part drawn.
const ENGINE_PARTS: Record<string, PartId> = {
  "lower arm": "lowerArm",
  "upper arm": "upperArm",
  upright: "upright",
  chassis: "upright",
  "front suspension": "upright",
  "kingpin axis": "kingpin",
  "tie rod": "tieRod",
  "steering arm": "steeringArm",
  "shaft neck": "neck",
  "cup mouth": "cup",
  "drive joint": "shaft",
  "cardan joint": "shaft",
  motor: "strength",
  gearing: "strength",
  material: "strength",
};

const PATH_PARTS: readonly [prefix: string, part: PartId][] = [
  ["frontView.lowerInner", "lowerArm"],
  ["frontView.lowerOuter", "lowerArm"],
  ["frontView.upperInner", "upperArm"],
  ["frontView.upperOuter", "upperArm"],
  ["frontView.wheelCentre", "wheel"],
  ["frontView.tyre", "wheel"],
  ["frontView.staticCamberDeg", "wheel"],
  ["frontView", "upright"],
  ["sideView", "kingpin"],
  ["topView.steeringArmBall", "steeringArm"],
  ["topView", "tieRod"],
  ["drive.neckDiameterMm", "neck"],
  ["drive.boreDiameterMm", "neck"],
  ["drive.cupMouthDiameterMm", "cup"],
  ["drive.pivotDepthMm", "cup"],
  ["drive.slot", "cup"],
  ["drive", "shaft"],
  ["strength", "strength"],
];

/** The handle whose point a field path belongs to (front view first), or null. */
export function handleForPath(path: string): string | null {
  const h = HANDLES.find((d) => path === d.u.path || path === d.v.path || `${path}.y` === d.u.path);
  return h ? h.id : null;
}

export function partForPath(path: string): PartId | null {
  for (const [prefix, part] of PATH_PARTS) if (path === prefix || path.startsWith(`${prefix}.`) || path.startsWith(prefix)) return part;
  return null;
}

/** A fault from the layout contract's first issue (a range: "invalid"; a check between fields: "impossible"). */
export function faultFromIssues(issues: readonly LayoutIssue[], kind: LayoutFault["kind"]): LayoutFault {
  const first = issues[0] ?? { path: "", message: "The layout is not valid." };
  return { kind, message: layoutMessageInWords(first.message), part: partForPath(first.path), handleId: handleForPath(first.path), path: first.path || null };
}

/** A fault from the engine's GeometryError (part + reason). */
export function faultFromGeometry(part: string, reason: string): LayoutFault {
  return { kind: "impossible", message: `${part}: ${reason}`, part: ENGINE_PARTS[part] ?? null, handleId: null, path: null };
}
