// Every point of the layout that a view can drag: which view, which two fields it moves, and how the
// view's plane axes map onto them. The plane is what the view draws, in mm, v up the screen:
//   front view (seen from ahead):  u = y (left, outboard on the left corner), v = z (up)
//   top view (seen from above, drawn in line with the front view): u = y, v = −x (forward is down)
import type { Layout } from "@/contracts/layout";
import { getAt, setAt, type LayoutPath } from "@/figures/layout-paths";

export type ViewId = "front" | "top";

/** Parts of the corner a message can point at (handles, or whole parts drawn in a view). */
export type PartId =
  | "lowerArm"
  | "upperArm"
  | "upright"
  | "wheel"
  | "tieRod"
  | "steeringArm"
  | "shaft"
  | "neck"
  | "cup"
  | "kingpin"
  | "strength";

interface AxisField {
  readonly path: LayoutPath;
  /** Plane value = sign × field value. */
  readonly sign: 1 | -1;
  /** Used when the field is absent (an optional coordinate). */
  readonly absent?: number;
}

export interface HandleDef {
  readonly id: string;
  readonly view: ViewId;
  readonly label: string;
  readonly part: PartId;
  readonly u: AxisField;
  readonly v: AxisField;
}

const yz = (id: string, label: string, part: PartId, base: string): HandleDef => ({
  id: `front:${id}`,
  view: "front",
  label,
  part,
  u: { path: `${base}.y`, sign: 1 },
  v: { path: `${base}.z`, sign: 1 },
});

const xy = (id: string, label: string, part: PartId, base: string): HandleDef => ({
  id: `top:${id}`,
  view: "top",
  label,
  part,
  u: { path: `${base}.y`, sign: 1 },
  v: { path: `${base}.x`, sign: -1, absent: 0 },
});

export const HANDLES: readonly HandleDef[] = [
  yz("lowerInner", "Lower arm, chassis pivot", "lowerArm", "frontView.lowerInner"),
  yz("lowerOuter", "Lower ball joint", "lowerArm", "frontView.lowerOuter"),
  yz("upperInner", "Upper arm, chassis pivot", "upperArm", "frontView.upperInner"),
  yz("upperOuter", "Upper ball joint", "upperArm", "frontView.upperOuter"),
  yz("wheelCentre", "Wheel centre", "wheel", "frontView.wheelCentre"),
  yz("inboardJoint", "Inboard joint (outdrive)", "shaft", "drive.inboardJoint"),
  yz("outboardJoint", "Outboard joint", "shaft", "drive.outboardJoint"),
  xy("steeringArmBall", "Steering arm ball", "steeringArm", "topView.steeringArmBall"),
  xy("rackEnd", "Tie-rod inner ball (rack end)", "tieRod", "topView.rackEnd"),
  xy("inboardJoint", "Inboard joint (outdrive)", "shaft", "drive.inboardJoint"),
  xy("outboardJoint", "Outboard joint", "shaft", "drive.outboardJoint"),
];

const BY_ID = new Map(HANDLES.map((h) => [h.id, h]));

export function handleById(id: string): HandleDef | undefined {
  return BY_ID.get(id);
}

export function handlesOf(view: ViewId): readonly HandleDef[] {
  return HANDLES.filter((h) => h.view === view);
}

function axisValue(layout: Layout, a: AxisField): number {
  const raw = getAt(layout, a.path);
  const v = typeof raw === "number" ? raw : (a.absent ?? 0);
  const r = a.sign * v;
  return r === 0 ? 0 : r; // no −0 on screen
}

/** The handle's position in its view's plane, mm. */
export function handlePlanePoint(layout: Layout, h: HandleDef): readonly [number, number] {
  return [axisValue(layout, h.u), axisValue(layout, h.v)];
}

/** The layout with the handle moved to plane point (u, v), mm (the third coordinate is untouched). */
export function withHandleAt(layout: Layout, h: HandleDef, u: number, v: number): Layout {
  // A signed zero would round-trip as "-0" in the panel: store a plain 0.
  const clean = (x: number) => (Object.is(x, -0) ? 0 : x);
  return setAt(setAt(layout, h.u.path, clean(h.u.sign * u)), h.v.path, clean(h.v.sign * v));
}
