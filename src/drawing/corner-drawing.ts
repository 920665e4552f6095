// What the front and top views draw, as plane polylines and points (mm), from the engine's pose.
// Pure: the Konva components only map these to the screen.
import type { Layout } from "@/contracts/layout";
import { wheelAxesMeet, type CornerPose, type WheelPose } from "@/engine";
import type { Vec3 } from "@/engine";
import type { PlaneBox, PlanePoint } from "./view-transform";
import { boxOf } from "./view-transform";

/** Front view plane (u, v) = (y, z). */
export const frontOf = (p: Vec3): PlanePoint => [p[1], p[2]];
/** Top view plane (u, v) = (y, −x): forward is down the screen, in line with the front view. */
export const topOf = (p: Vec3): PlanePoint => [p[1], -p[0]];

const add = (a: Vec3, b: Vec3, s: number): Vec3 => [a[0] + b[0] * s, a[1] + b[1] * s, a[2] + b[2] * s];

/** The tyre's outline in the wheel plane: centre ± radius along the plane's up and forward, ± half width along the spin axis. */
function tyreCorners(w: WheelPose, radiusMm: number, widthMm: number, along: "up" | "forward"): Vec3[] {
  const f = w.forward;
  const s = w.spinAxis;
  const up: Vec3 = [f[1] * s[2] - f[2] * s[1], f[2] * s[0] - f[0] * s[2], f[0] * s[1] - f[1] * s[0]];
  const r = along === "up" ? up : f;
  const c = w.wheelCentre;
  const hw = widthMm / 2;
  return [add(add(c, r, radiusMm), s, hw), add(add(c, r, radiusMm), s, -hw), add(add(c, r, -radiusMm), s, -hw), add(add(c, r, -radiusMm), s, hw)];
}

export interface FrontDrawing {
  readonly lowerArm: readonly [PlanePoint, PlanePoint];
  readonly upperArm: readonly [PlanePoint, PlanePoint];
  readonly upright: readonly PlanePoint[];
  readonly tyre: readonly PlanePoint[];
  readonly wheelCentre: PlanePoint;
  readonly contactPatch: PlanePoint;
  readonly shaft: readonly [PlanePoint, PlanePoint];
  /** From the ground point up past the upper ball joint. */
  readonly kingpinAxis: readonly [PlanePoint, PlanePoint];
  readonly kingpinGround: PlanePoint;
  readonly instantCentre: PlanePoint | null;
  readonly rollCentre: PlanePoint | null;
  readonly groundZ: number;
  readonly lowerArmLengthMm: number;
  readonly upperArmLengthMm: number;
  /** Lateral ground distance, + when the axis meets the ground inboard of the contact centre. */
  readonly scrubRadiusMm: number;
}

export function frontDrawing(pose: CornerPose, layout: Layout): FrontDrawing {
  const w = pose.left;
  const f = layout.frontView;
  const li = frontOf(pose.lowerInner);
  const ui = frontOf(pose.upperInner);
  const lo = frontOf(w.lowerOuter);
  const uo = frontOf(w.upperOuter);
  const kg = frontOf(w.kingpinGround);
  const dir: PlanePoint = [uo[0] - kg[0], uo[1] - kg[1]];
  const len = Math.hypot(dir[0], dir[1]) || 1;
  const above = Math.max(6, f.tyreRadiusMm * 0.25);
  return {
    lowerArm: [li, lo],
    upperArm: [ui, uo],
    upright: [lo, uo, frontOf(w.wheelCentre), lo],
    tyre: tyreCorners(w, f.tyreRadiusMm, f.tyreWidthMm, "up").map(frontOf),
    wheelCentre: frontOf(w.wheelCentre),
    contactPatch: frontOf(w.contactPatch),
    shaft: [frontOf(w.inboardJoint), frontOf(w.outboardJoint)],
    kingpinAxis: [kg, [uo[0] + (dir[0] / len) * above, uo[1] + (dir[1] / len) * above]],
    kingpinGround: kg,
    instantCentre: pose.instantCentre ? [pose.instantCentre[0], pose.instantCentre[1]] : null,
    rollCentre: pose.rollCentre,
    groundZ: w.contactPatch[2],
    lowerArmLengthMm: Math.hypot(lo[0] - li[0], lo[1] - li[1]),
    upperArmLengthMm: Math.hypot(uo[0] - ui[0], uo[1] - ui[1]),
    scrubRadiusMm: w.contactPatch[1] - w.kingpinGround[1],
  };
}

/** The static front view's fitting box: the corner, the centreline and the ground. */
export function frontBox(layout: Layout): PlaneBox {
  const f = layout.frontView;
  const d = layout.drive;
  const outer = f.wheelCentre.y + f.tyreWidthMm / 2 + f.tyreRadiusMm * 0.1;
  return boxOf([
    [0, 0],
    [outer, 0],
    [f.lowerInner.y, f.lowerInner.z],
    [f.upperInner.y, f.upperInner.z],
    [d.inboardJoint.y, d.inboardJoint.z],
    [f.wheelCentre.y, f.wheelCentre.z + f.tyreRadiusMm],
  ])!;
}

export interface TopWheelDrawing {
  readonly tyre: readonly PlanePoint[];
  readonly wheelCentre: PlanePoint;
  readonly kingpinGround: PlanePoint;
  readonly contactPatch: PlanePoint;
  readonly steeringArm: readonly [PlanePoint, PlanePoint];
  readonly tieRod: readonly [PlanePoint, PlanePoint];
  readonly shaft: readonly [PlanePoint, PlanePoint];
  /** The wheel's spin axis through its centre, long enough to reach the turn centre. */
  readonly axisLine: readonly [PlanePoint, PlanePoint];
  readonly roadWheelDeg: number;
}

export interface TopDrawing {
  readonly left: TopWheelDrawing;
  readonly right: TopWheelDrawing;
  readonly rack: readonly [PlanePoint, PlanePoint];
  /** Where the two wheel axes meet (plane point), null when parallel. */
  readonly turnCentre: PlanePoint | null;
  /** The rear axle line's plane v (= wheelbase, since v = −x). */
  readonly rearAxleV: number;
  /** Turn centre's distance ahead (+) of the rear axle line, mm; null when the axes are parallel. */
  readonly turnCentreAheadOfRearAxleMm: number | null;
  /** Caster trail of the left wheel on the ground, + when the axis meets the ground ahead of the contact centre. */
  readonly trailMm: number;
  /** Steering arm length in plan: from the kingpin axis to the arm ball, mm. */
  readonly steeringArmLengthMm: number;
}

function topWheel(w: WheelPose, layout: Layout, reach: number): TopWheelDrawing {
  const f = layout.frontView;
  const c = topOf(w.wheelCentre);
  // The spin axis points outboard on both wheels; the construction runs inboard, towards the turn centre.
  const inward: PlanePoint = [-w.spinAxis[1], w.spinAxis[0]];
  const n = Math.hypot(inward[0], inward[1]) || 1;
  const inboardDir: PlanePoint = [inward[0] / n, inward[1] / n];
  return {
    tyre: tyreCorners(w, f.tyreRadiusMm, f.tyreWidthMm, "forward").map(topOf),
    wheelCentre: c,
    kingpinGround: topOf(w.kingpinGround),
    contactPatch: topOf(w.contactPatch),
    steeringArm: [topOf(w.kingpinGround), topOf(w.steeringArmBall)],
    tieRod: [topOf(w.steeringArmBall), topOf(w.rackEnd)],
    shaft: [topOf(w.inboardJoint), topOf(w.outboardJoint)],
    axisLine: [c, [c[0] + inboardDir[0] * reach, c[1] + inboardDir[1] * reach]],
    roadWheelDeg: w.roadWheelDeg,
  };
}

export function topDrawing(pose: CornerPose, layout: Layout): TopDrawing {
  const L = layout.topView.wheelbaseMm;
  const meet = wheelAxesMeet(pose.left, pose.right);
  const reach = meet ? Math.min(Math.hypot(meet[0], meet[1]) * 1.2 + L, 50_000) : L * 1.5;
  const w = pose.left;
  const armBall = w.steeringArmBall;
  // Plan distance from the kingpin axis (at the arm ball's height) to the arm ball.
  const kz = w.kingpinGround;
  const k = [w.upperOuter[0] - kz[0], w.upperOuter[1] - kz[1], w.upperOuter[2] - kz[2]];
  const t = (armBall[2] - kz[2]) / (k[2] || 1);
  const axisAtBall: PlanePoint = [kz[1] + t * k[1], -(kz[0] + t * k[0])];
  return {
    left: topWheel(pose.left, layout, reach),
    right: topWheel(pose.right, layout, reach),
    rack: [topOf(pose.left.rackEnd), topOf(pose.right.rackEnd)],
    turnCentre: meet ? [meet[1], -meet[0]] : null,
    rearAxleV: L,
    turnCentreAheadOfRearAxleMm: meet ? meet[0] + L : null,
    trailMm: w.kingpinGround[0] - w.contactPatch[0],
    steeringArmLengthMm: Math.hypot(armBall[1] - axisAtBall[0], -armBall[0] - axisAtBall[1]),
  };
}

/** The top view's fitting box: both front wheels and the steering, the rear axle left out. */
export function topBox(layout: Layout): PlaneBox {
  const f = layout.frontView;
  const t = layout.topView;
  const outer = f.wheelCentre.y + f.tyreWidthMm / 2 + 4;
  const r = f.tyreRadiusMm + 4;
  return boxOf([
    [outer, r],
    // Ahead of the tyres, room for the figures set there (the arm and trail of the left wheel).
    [-outer, -r * 1.5],
    [t.steeringArmBall.y, -t.steeringArmBall.x],
    [t.rackEnd.y, -t.rackEnd.x],
  ])!;
}
