/**
 * The static 3-D points of a layout's left corner that every stage of an analysis starts from: the
 * kingpin axis through the ball joints (tilted by caster), the steering arm ball, the rack end, the
 * joint centres, the spin axis and the wheel centre. Vehicle frame (ISO 8855), mm; defaults for
 * absent coordinates as the layout contract documents them.
 */
import type { KitLayout } from "./kit-layout";
import type { Vec3 } from "./math/vec3";
import { kingpinAxisFromBallJoints, spinAxisFromCamberDeg, type KingpinAxis } from "./steering/steer-axis";

export interface StaticPoints {
  readonly axis: KingpinAxis;
  readonly armBall: Vec3;
  readonly rackEnd: Vec3;
  readonly outboardJoint: Vec3;
  readonly inboardJoint: Vec3;
  /** Unit spin axis of the left wheel, pointing outboard. */
  readonly spinAxis: Vec3;
  readonly wheelCentre: Vec3;
}

export function staticPoints(layout: KitLayout): StaticPoints {
  const f = layout.frontView;
  const t = layout.topView;
  const d = layout.drive;
  const axis = kingpinAxisFromBallJoints([f.lowerOuter.y, f.lowerOuter.z], [f.upperOuter.y, f.upperOuter.z], layout.sideView.casterDeg, layout.sideView.casterOffsetMm ?? 0, f.wheelCentre.z);
  const armZ = t.steeringArmBall.z ?? f.wheelCentre.z;
  return {
    axis,
    armBall: [t.steeringArmBall.x, t.steeringArmBall.y, armZ],
    rackEnd: [t.rackEnd.x, t.rackEnd.y, t.rackEnd.z ?? armZ],
    outboardJoint: [d.outboardJoint.x ?? 0, d.outboardJoint.y, d.outboardJoint.z],
    inboardJoint: [d.inboardJoint.x ?? 0, d.inboardJoint.y, d.inboardJoint.z],
    spinAxis: spinAxisFromCamberDeg(f.staticCamberDeg),
    wheelCentre: [0, f.wheelCentre.y, f.wheelCentre.z],
  };
}

/** Tie-rod length of the static layout (arm ball to rack end), mm. */
export function staticTieRodLengthMm(pts: StaticPoints): number {
  return Math.hypot(pts.armBall[0] - pts.rackEnd[0], pts.armBall[1] - pts.rackEnd[1], pts.armBall[2] - pts.rackEnd[2]);
}
