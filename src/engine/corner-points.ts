/**
 * The static 3-D points of a layout's left corner that every stage of an analysis starts from: the
 * kingpin axis through the ball joints (tilted by caster), the steering arm ball, the tie-rod inner ball
 * and what moves it (rack or bellcrank), the joint centres, the spin axis and the wheel centre. Vehicle
 * frame (ISO 8855), mm; defaults for absent coordinates as the layout contract documents them.
 */
import type { KitLayout } from "./kit-layout";
import type { Vec3 } from "./math/vec3";
import { bellcrankLinkage, rackLinkage, type ArmBallCircle, type InputLinkage, type SteerInputKind } from "./steering/linkage";
import { kingpinAxisFromBallJoints, spinAxisFromCamberDeg, type KingpinAxis } from "./steering/steer-axis";

/** The steering input: its kind, its travel each way (rack mm or bellcrank degrees) and, for a bellcrank, its pivot. */
export interface SteerInput {
  readonly kind: SteerInputKind;
  /** Travel each way from centre, in the input's unit (mm for a rack, degrees for a bellcrank). */
  readonly travel: number;
  /** Bellcrank pivot at the inner ball's height (its axis is vertical); null for a rack. */
  readonly pivot: Vec3 | null;
}

export interface StaticPoints {
  readonly axis: KingpinAxis;
  readonly armBall: Vec3;
  /** Tie-rod inner ball with the input centred. */
  readonly tieRodInner: Vec3;
  readonly input: SteerInput;
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
  const innerZ = t.tieRodInner.z ?? armZ;
  const si = t.steeringInput;
  const input: SteerInput =
    si.kind === "rack" ? { kind: "rack", travel: si.travelMm, pivot: null } : { kind: "bellcrank", travel: si.travelDeg, pivot: [si.pivot.x, si.pivot.y, innerZ] };
  return {
    axis,
    armBall: [t.steeringArmBall.x, t.steeringArmBall.y, armZ],
    tieRodInner: [t.tieRodInner.x, t.tieRodInner.y, innerZ],
    input,
    outboardJoint: [d.outboardJoint.x ?? 0, d.outboardJoint.y, d.outboardJoint.z],
    inboardJoint: [d.inboardJoint.x ?? 0, d.inboardJoint.y, d.inboardJoint.z],
    spinAxis: spinAxisFromCamberDeg(f.staticCamberDeg),
    wheelCentre: [0, f.wheelCentre.y, f.wheelCentre.z],
  };
}

/** Tie-rod length of the static layout (arm ball to inner ball), mm. */
export function staticTieRodLengthMm(pts: StaticPoints): number {
  return Math.hypot(pts.armBall[0] - pts.tieRodInner[0], pts.armBall[1] - pts.tieRodInner[1], pts.armBall[2] - pts.tieRodInner[2]);
}

/** The tie-rod closure of this corner's steering input for an arm-ball circle (one suspension pose). */
export function steerInputLinkage(pts: StaticPoints, circle: ArmBallCircle, tieRodLengthMm: number, branch: 1 | -1): InputLinkage {
  return pts.input.kind === "rack"
    ? rackLinkage(circle, pts.tieRodInner, tieRodLengthMm, branch)
    : bellcrankLinkage(circle, pts.tieRodInner, pts.input.pivot!, tieRodLengthMm, branch);
}
