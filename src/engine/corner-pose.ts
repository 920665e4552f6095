/**
 * Where every part of the corner is at one travel and one rack position: what the editor draws while the
 * designer previews steer and travel. The same solves as analyzeLayout (front-view four-bar, knuckle about
 * the kingpin axis with a fixed-length tie rod), returned as points instead of figures.
 *
 * Vehicle frame (ISO 8855: x forward, y left, z up; origin on the ground under the centreline on the front
 * axle line), mm and degrees. The left wheel is solved at steering input q (rack mm or bellcrank degrees);
 * the right wheel is the mirror (y → −y) of the left solved at −q, exactly as the analysis treats it.
 */
import { staticPoints, staticTieRodLengthMm, steerInputLinkage, type StaticPoints } from "./corner-points";
import type { KitLayout } from "./kit-layout";
import { clampUnit, radToDeg } from "./math/angle";
import { pointRotateAboutAxis, vec3RotateAboutAxis, vec3RotateX } from "./math/rotation";
import type { Vec2 } from "./math/vec2";
import type { Vec3 } from "./math/vec3";
import { armBallCircle, innerBallAt, knuckleRotationForInputRads, tieRodBranch, tieRodClosure } from "./steering/linkage";
import { kingpinGroundPoint, type KingpinAxis } from "./steering/steer-axis";
import { frontViewKnucklePoint, frontViewModel, frontViewPoseAtTravel, type FrontViewModel } from "./suspension/front-view";

/** One wheel's steered knuckle at the pose (left wheel in its own frame; the right one mirrored). */
export interface WheelPose {
  /** False where the tie rod cannot reach at this input position: the knuckle is then drawn unsteered. */
  readonly steerSolved: boolean;
  /** Knuckle rotation about the kingpin axis, degrees, + turns this wheel to the left. */
  readonly knuckleRotationDeg: number;
  /** Heading of the wheel's forward vector in the ground plane, degrees, + left. */
  readonly roadWheelDeg: number;
  /** Camber with steer, degrees, + top outboard (for the right wheel: its own outboard, −y). */
  readonly camberDeg: number;
  readonly wheelCentre: Vec3;
  /** Contact centre of a rigid tyre: wheel centre − radius along the wheel plane's up direction. */
  readonly contactPatch: Vec3;
  /** Unit spin axis, pointing outboard. */
  readonly spinAxis: Vec3;
  /** Unit forward vector of the wheel plane (its heading). */
  readonly forward: Vec3;
  readonly lowerOuter: Vec3;
  readonly upperOuter: Vec3;
  /** Where the kingpin axis meets the ground under the wheel. */
  readonly kingpinGround: Vec3;
  readonly steeringArmBall: Vec3;
  /** Tie-rod inner ball, moved with the rack or turned with the bellcrank. */
  readonly tieRodInner: Vec3;
  /** The bellcrank's pivot (vertical axis through it) at the inner ball's height; null for a rack. */
  readonly bellcrankPivot: Vec3 | null;
  readonly inboardJoint: Vec3;
  readonly outboardJoint: Vec3;
  /** Drive joint operating angle between the shaft and the stub axle, degrees, ≥ 0. */
  readonly jointAngleDeg: number;
}

export interface CornerPose {
  readonly travelMm: number;
  /** Rack mm or bellcrank degrees. */
  readonly steerInput: number;
  /** Chassis pivots of the left corner (fixed). */
  readonly lowerInner: Vec3;
  readonly upperInner: Vec3;
  readonly left: WheelPose;
  /** The right wheel: the left solved at −input, mirrored into y < 0. */
  readonly right: WheelPose;
  /** Front-view instant centre (y, z) of the left upright, null when the arms are parallel. */
  readonly instantCentre: Vec2 | null;
  /** Kinematic roll centre on the centreline (y = 0, z), null when undefined. */
  readonly rollCentre: Vec2 | null;
  readonly camberGainDegPerMm: number;
}

/** A layout prepared once for many poses (the travel slider and the sweep reuse it). */
export interface CornerPoser {
  readonly model: FrontViewModel;
  readonly points: StaticPoints;
  readonly tieRodLengthMm: number;
  readonly branch: 1 | -1;
  readonly layout: KitLayout;
}

/** Solves the static layout once; throws GeometryError for a corner that cannot close or steer. */
export function cornerPoser(layout: KitLayout): CornerPoser {
  const model = frontViewModel(layout.frontView);
  const points = staticPoints(layout);
  const tieRodLengthMm = staticTieRodLengthMm(points);
  const branch = tieRodBranch(tieRodClosure(armBallCircle(points.axis, points.armBall), points.tieRodInner, tieRodLengthMm));
  return { model, points, tieRodLengthMm, branch, layout };
}

const mirror = (p: Vec3): Vec3 => [p[0], -p[1], p[2]];

function mirrorWheel(w: WheelPose): WheelPose {
  return {
    ...w,
    knuckleRotationDeg: -w.knuckleRotationDeg,
    roadWheelDeg: -w.roadWheelDeg,
    wheelCentre: mirror(w.wheelCentre),
    contactPatch: mirror(w.contactPatch),
    spinAxis: mirror(w.spinAxis),
    forward: mirror(w.forward),
    lowerOuter: mirror(w.lowerOuter),
    upperOuter: mirror(w.upperOuter),
    kingpinGround: mirror(w.kingpinGround),
    steeringArmBall: mirror(w.steeringArmBall),
    tieRodInner: mirror(w.tieRodInner),
    bellcrankPivot: w.bellcrankPivot ? mirror(w.bellcrankPivot) : null,
    inboardJoint: mirror(w.inboardJoint),
    outboardJoint: mirror(w.outboardJoint),
  };
}

/**
 * The corner at wheel-centre travel `travelMm` (+ bump) and steering input `steerInput` (rack mm, + towards
 * +y; or bellcrank degrees, + counter-clockwise from above). Throws GeometryError where the arms cannot
 * close at that travel; an input position the tie rod cannot reach gives steerSolved: false for that wheel
 * rather than an error, so a preview never fails on it.
 */
export function cornerPoseAt(poser: CornerPoser, travelMm: number, steerInput: number): CornerPose {
  const { model, points: pts } = poser;
  const pose = frontViewPoseAtTravel(model, travelMm);
  const rot = pose.uprightRotationRad;
  const axisPoint = frontViewKnucklePoint(model, pose, pts.axis.point);
  const axis: KingpinAxis = { point: axisPoint, direction: vec3RotateX(pts.axis.direction, rot) };
  const armBall0 = frontViewKnucklePoint(model, pose, pts.armBall);
  const linkage = steerInputLinkage(pts, armBallCircle(axis, armBall0), poser.tieRodLengthMm, poser.branch);
  const knuckle = {
    wheelCentre: frontViewKnucklePoint(model, pose, pts.wheelCentre),
    spinAxis: vec3RotateX(pts.spinAxis, rot),
    outboardJoint: frontViewKnucklePoint(model, pose, pts.outboardJoint),
    armBall: armBall0,
  };
  const f = poser.layout.frontView;
  const lowerOuter: Vec3 = [axisPoint[0], pose.lowerOuter[0], pose.lowerOuter[1]];
  const upperOuterStatic: Vec3 = [0, f.upperOuter.y, f.upperOuter.z];
  const upperOuterOnAxis = frontViewKnucklePoint(model, pose, upperOuterStatic);
  // The upper ball joint lies on the kingpin axis: its x follows the axis (caster) at its height.
  const tUpper = (upperOuterOnAxis[2] - axisPoint[2]) / axis.direction[2];
  const upperOuter: Vec3 = [axisPoint[0] + tUpper * axis.direction[0], upperOuterOnAxis[1], upperOuterOnAxis[2]];

  const wheelAt = (s: number): WheelPose => {
    const phi = knuckleRotationForInputRads(linkage, s);
    const solved = phi !== null;
    const a = phi ?? 0;
    const turn = (p: Vec3) => pointRotateAboutAxis(p, axisPoint, axis.direction, a);
    const w = vec3RotateAboutAxis(knuckle.spinAxis, axis.direction, a);
    const fwd = vec3RotateAboutAxis([1, 0, 0], axis.direction, a);
    const centre = turn(knuckle.wheelCentre);
    // Wheel-plane up direction: forward × spin (spin points outboard, +y on the left).
    const up: Vec3 = [fwd[1] * w[2] - fwd[2] * w[1], fwd[2] * w[0] - fwd[0] * w[2], fwd[0] * w[1] - fwd[1] * w[0]];
    const r = f.tyreRadiusMm;
    const contact: Vec3 = [centre[0] - r * up[0], centre[1] - r * up[1], centre[2] - r * up[2]];
    const outboard = turn(knuckle.outboardJoint);
    const s3: Vec3 = [outboard[0] - pts.inboardJoint[0], outboard[1] - pts.inboardJoint[1], outboard[2] - pts.inboardJoint[2]];
    const cx = s3[1] * w[2] - s3[2] * w[1];
    const cy = s3[2] * w[0] - s3[0] * w[2];
    const cz = s3[0] * w[1] - s3[1] * w[0];
    return {
      steerSolved: solved,
      knuckleRotationDeg: radToDeg(a),
      roadWheelDeg: radToDeg(Math.atan2(fwd[1], fwd[0])),
      camberDeg: radToDeg(-Math.asin(clampUnit(w[2]))),
      wheelCentre: centre,
      contactPatch: contact,
      spinAxis: w,
      forward: fwd,
      lowerOuter,
      upperOuter,
      kingpinGround: kingpinGroundPoint(axis, contact[2]),
      steeringArmBall: turn(knuckle.armBall),
      tieRodInner: innerBallAt(pts.input.kind, pts.tieRodInner, pts.input.pivot, s),
      bellcrankPivot: pts.input.pivot,
      inboardJoint: pts.inboardJoint,
      outboardJoint: outboard,
      jointAngleDeg: radToDeg(Math.atan2(Math.sqrt(cx * cx + cy * cy + cz * cz), s3[0] * w[0] + s3[1] * w[1] + s3[2] * w[2])),
    };
  };

  const left = wheelAt(steerInput);
  const right = mirrorWheel(wheelAt(-steerInput));
  const cpZ = pose.contactPatch[1];
  return {
    travelMm,
    steerInput,
    lowerInner: [0, f.lowerInner.y, f.lowerInner.z],
    upperInner: [0, f.upperInner.y, f.upperInner.z],
    left,
    right,
    instantCentre: pose.instantCentre,
    rollCentre: pose.rollCentreHeightMm === null ? null : [0, cpZ + pose.rollCentreHeightMm],
    camberGainDegPerMm: pose.camberGainDegPerMm,
  };
}

/**
 * Where the two front wheels' axes meet in the ground plane (x, y), mm, or null when they are parallel:
 * the turn centre the steering gives. With 100 % Ackermann it lies on the rear axle line x = −wheelbase
 * (DESIGN.md's convention); a rigid-body, no-slip construction (common practice).
 */
export function wheelAxesMeet(left: WheelPose, right: WheelPose): Vec2 | null {
  const p: Vec2 = [left.wheelCentre[0], left.wheelCentre[1]];
  const q: Vec2 = [right.wheelCentre[0], right.wheelCentre[1]];
  // Axis directions in the ground plane: perpendicular to each wheel's heading.
  const u: Vec2 = [-left.forward[1], left.forward[0]];
  const v: Vec2 = [-right.forward[1], right.forward[0]];
  const den = u[0] * v[1] - u[1] * v[0];
  if (Math.abs(den) < 1e-9) return null;
  const t = ((q[0] - p[0]) * v[1] - (q[1] - p[1]) * v[0]) / den;
  const point: Vec2 = [p[0] + t * u[0], p[1] + t * u[1]];
  return Number.isFinite(point[0]) && Number.isFinite(point[1]) && Math.hypot(point[0], point[1]) < 1e7 ? point : null;
}
