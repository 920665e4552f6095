/**
 * Every output of analyzeLayout with its unit, sign convention and its methods entry (methods/
 * method-entries.ts), whose citations are its sources. The README's table of outputs is made from this
 * table (scripts/output-fields-doc.ts writes it; a test keeps the two equal) and the public methods page
 * renders the same entries, so the API docs and the methods page cannot drift.
 *
 * Paths use [] for array items and * for any one key (steerLock.* is worst, static and perTravel[]).
 */
import { METHOD_ENTRIES, methodByKey } from "./methods/method-entries";

export interface OutputField {
  readonly path: string;
  readonly unit: string;
  readonly sign: string;
  /** Key of the methods entry (an anchor of /methods) that defines the figure and cites its sources. */
  readonly method: string;
}

const f = (path: string, unit: string, sign: string, method: string): OutputField => ({ path, unit, sign, method });

export const OUTPUT_FIELDS: readonly OutputField[] = [
  f("resultSchema", "—", "version of the answer's shape (2)", "result-document"),
  f("grid.travelSteps", "—", "travel positions solved, droop to bump", "result-document"),
  f("grid.steerSteps", "—", "steering-input positions solved, full one way to full the other", "result-document"),
  f("atStatic.*", "—", "every travel[] figure at ride height (travel 0)", "wheel-travel"),
  f("travel[].travelMm", "mm", "+ bump (wheel centre up relative to the body), − droop", "wheel-travel"),
  f("travel[].lowerArmAngleDeg", "°", "+ outer end higher than inner, front view", "front-view-four-bar"),
  f("travel[].upperArmAngleDeg", "°", "+ outer end higher than inner, front view", "front-view-four-bar"),
  f("travel[].camberDeg", "°", "+ wheel top leans outboard (relative to the body)", "camber"),
  f("travel[].camberGainDegPerMm", "°/mm", "dγ/dz per mm of wheel-centre travel; − = top moves inboard in bump", "camber-gain"),
  f("travel[].trackChangeMm", "mm", "+ wider (both sides in heave)", "contact-patch"),
  f("travel[].contactPatchYMm", "mm", "+ left (outboard on the left corner)", "contact-patch"),
  f("travel[].contactPatchZMm", "mm", "+ up; the ground under the wheel at this travel", "contact-patch"),
  f("travel[].instantCentreYMm", "mm", "+ left; null when the arms are parallel (IC at infinity)", "roll-centre"),
  f("travel[].instantCentreZMm", "mm", "+ up; null when the arms are parallel", "roll-centre"),
  f("travel[].rollCentreHeightMm", "mm", "+ above the ground under the wheel at this travel", "roll-centre"),
  f("travel[].kingpinInclinationDeg", "°", "+ axis top leans inboard", "kingpin-inclination"),
  f("travel[].scrubRadiusMm", "mm", "+ axis meets the ground inboard of the contact centre", "scrub-radius"),
  f("travel[].bumpSteerDeg", "°", "+ left (toe-out on the left wheel), input centred", "bump-steer"),
  f("travel[].plungeMm", "mm", "+ the joint centres move apart (shaft must extend)", "plunge"),
  f("travel[].jointAngleDeg", "°", "≥ 0, bend between shaft and stub axle, input centred", "joint-angle"),
  f("steerAxis.kingpinInclinationDeg", "°", "+ axis top leans inboard", "kingpin-inclination"),
  f("steerAxis.casterDeg", "°", "+ axis top leans rearward", "caster"),
  f("steerAxis.scrubRadiusMm", "mm", "+ axis ground point inboard of the contact centre", "scrub-radius"),
  f("steerAxis.casterTrailMm", "mm", "+ axis meets the ground ahead of the contact centre", "caster-trail"),
  f("steerAxis.hubOffsetMm", "mm", "+ axis inboard of the wheel centre at hub height", "hub-offset"),
  f("steerAxis.spindleLengthMm", "mm", "+ foot of the common perpendicular inboard of the wheel centre", "hub-offset"),
  f("steerAxis.spindleOffsetMm", "mm", "≥ 0, common perpendicular of spin and steering axes", "hub-offset"),
  f("steerAxis.kingpinTrackMm", "mm", "> 0, between the two axes' ground points", "kingpin-track"),
  f("steering.input.kind", "—", "rack | bellcrank", "steering-input"),
  f("steering.input.unit", "—", "mm (rack) | deg (bellcrank): the unit of every steerInput", "steering-input"),
  f("steering.input.travel", "mm or °", "> 0, each way from centre", "steering-input"),
  f("steering.leftTurnInputSign", "—", "+1 when a + input (rack to +y, bellcrank counter-clockwise) turns the car left", "steering-input"),
  f("steering.tieRodLengthMm", "mm", "> 0, from the static layout", "steering-input"),
  f("steering.steps[].steerInput", "mm or °", "+ rack towards +y, + bellcrank counter-clockwise from above", "steering-input"),
  f("steering.steps[].leftKnuckleRotationDeg", "°", "+ left, about the upward kingpin axis", "road-wheel-angles"),
  f("steering.steps[].leftRoadWheelDeg", "°", "+ left: heading of the wheel's forward vector in the ground plane", "road-wheel-angles"),
  f("steering.steps[].rightRoadWheelDeg", "°", "+ left; mirror of the left wheel at −input", "road-wheel-angles"),
  f("steering.steps[].leftCamberDeg", "°", "+ top outboard (exact, with steer)", "steer-camber"),
  f("steering.steps[].rightCamberDeg", "°", "+ top outboard", "steer-camber"),
  f("steering.steps[].leftJointAngleDeg", "°", "≥ 0", "joint-angle"),
  f("steering.steps[].rightJointAngleDeg", "°", "≥ 0", "joint-angle"),
  f("steering.steps[].innerDeg", "°", "+ in the turn being made (inner wheel)", "road-wheel-angles"),
  f("steering.steps[].outerDeg", "°", "+ in the turn being made (outer wheel)", "road-wheel-angles"),
  f("steering.steps[].ackermannTurnCentrePct", "%", "P_cot: 100 = axes meet on the rear axle line, 0 = parallel, − = reverse; null below 0.5°", "ackermann"),
  f("steering.steps[].ackermannInnerRefPct", "%", "P_in (inner wheel as reference), shown beside P_cot; null below 0.5°", "ackermann"),
  f("steering.steps[].ackermannOuterRefPct", "%", "P_out (outer wheel as reference), shown beside P_cot; null below 0.5°", "ackermann"),
  f("ackermann.convention", "—", "names the reported form (turn-centre)", "ackermann"),
  f("ackermann.minReportingAngleDeg", "°", "below this inner or outer angle the percentages are null (0/0 near straight ahead)", "ackermann"),
  f("ackermann.atLockPct", "%", "P_cot at the static steer lock; null when the lock is under the reporting angle", "ackermann"),
  f("ackermann.innerRefAtLockPct", "%", "P_in at the static steer lock", "ackermann"),
  f("ackermann.outerRefAtLockPct", "%", "P_out at the static steer lock", "ackermann"),
  f("ackermann.kingpinTrackMm", "mm", "> 0, w of the formula", "kingpin-track"),
  f("ackermann.wheelbaseMm", "mm", "> 0, L of the formula", "kingpin-track"),
  f("steerLock.*.travelMm", "mm", "+ bump; the travel of this lock (worst: where the inner wheel's lock is smallest)", "steer-lock"),
  f("steerLock.*.steerInput", "mm or °", "input position at lock for a left turn (right turn mirrors)", "steer-lock"),
  f("steerLock.*.innerDeg", "°", "+ inner road-wheel angle at lock", "steer-lock"),
  f("steerLock.*.outerDeg", "°", "+ outer road-wheel angle at lock", "steer-lock"),
  f("steerLock.*.jointAngleDeg", "°", "larger joint angle of the two wheels at lock", "steer-lock"),
  f("steerLock.*.limitedBy", "—", "neck-contact | slot-limit | rated-angle | toggle | input-travel", "steer-lock"),
  f("steeringStop.status", "—", "needed | not-needed (the input's travel ends first) | no-position (past the limit with the wheels straight)", "steering-stop"),
  f("steeringStop.limitedBy", "—", "what binds first at the worst travel; input-travel when no stop is needed", "steering-stop"),
  f("steeringStop.worstTravelMm", "mm", "+ bump; where the limit comes earliest along the input", "steering-stop"),
  f("steeringStop.limitInput", "mm or °", "left turn, signed as the input moves: the furthest a stop may sit", "steering-stop"),
  f("steeringStop.limitInnerDeg", "°", "+ inner road-wheel angle at the limit, worst travel", "steering-stop"),
  f("steeringStop.limitOuterDeg", "°", "+ outer road-wheel angle at the limit, worst travel", "steering-stop"),
  f("steeringStop.leftTurnStopInput", "mm or °", "the proposed stop for a left turn, signed as the input moves", "steering-stop"),
  f("steeringStop.rightTurnStopInput", "mm or °", "the proposed stop for a right turn (the mirror)", "steering-stop"),
  f("steeringStop.marginDeg", "°", "≥ 0, set-back of the proposed stop in inner road-wheel angle", "steering-stop"),
  f("steeringStop.stopInnerDeg", "°", "+ inner road-wheel angle at the proposed stop, worst travel", "steering-stop"),
  f("steeringStop.stopOuterDeg", "°", "+ outer road-wheel angle at the proposed stop, worst travel", "steering-stop"),
  f("steeringStop.jointAngleAtStopDeg", "°", "≥ 0, largest joint angle of either wheel at the stop over all travel", "steering-stop"),
  f("steeringStop.angleMarginDeg", "°", "+ angle still free before the joint limit at the stop", "steering-stop"),
  f("steeringStop.clearanceAtStopMm", "mm", "+ clear, 0 touching; null for a slotted cup", "neck-clearance"),
  f("steeringStop.overrun", "mm or °", "≥ 0, how far the present travel runs past the limit", "steering-stop"),
  f("steeringStop.toggle", "—", "null when the tie rod does not go over centre within the travel", "toggle"),
  f("steeringStop.toggle.steerInput", "mm or °", "left turn: where the tie rod goes over centre", "toggle"),
  f("steeringStop.toggle.travelMm", "mm", "+ bump; the travel where it comes first", "toggle"),
  f("drive.jointType", "—", "dogbone | cvd | cv-ball | single-cardan | double-cardan", "joint-limit"),
  f("drive.ratedAngleDeg", "°", "> 0, as the layout gives it", "joint-limit"),
  f("drive.neckContactAngleDeg", "°", "articulation where the neck meets the mouth; null for a slotted cup", "joint-limit"),
  f("drive.slotLimitDeg", "°", "the slot's end; null for a closed cup", "joint-limit"),
  f("drive.jointLimitDeg", "°", "min(cup limit, rated angle)", "joint-limit"),
  f("drive.jointLimitBy", "—", "neck-contact | slot-limit | rated-angle", "joint-limit"),
  f("drive.shaftLengthStaticMm", "mm", "> 0, joint centre to joint centre at static", "plunge"),
  f("drive.staticJointAngleDeg", "°", "≥ 0, at ride height, input centred", "joint-angle"),
  f("drive.maxJointAngleDeg", "°", "largest over the full grid", "joint-angle"),
  f("drive.maxJointAngleAtTravelMm", "mm", "+ bump; where the largest occurs", "joint-angle"),
  f("drive.maxJointAngleAtSteerInput", "mm or °", "input position where the largest occurs", "joint-angle"),
  f("drive.maxJointAngleWithinLockDeg", "°", "largest inside each travel's steer lock", "joint-angle"),
  f("drive.jointMarginDeg", "°", "+ spare angle to the limit inside the lock", "joint-limit"),
  f("drive.plungeMinMm", "mm", "+ joint centres apart, over the whole envelope", "plunge"),
  f("drive.plungeMaxMm", "mm", "+ joint centres apart, over the whole envelope", "plunge"),
  f("drive.cardan", "—", "null for a constant-velocity joint", "cardan-fluctuation"),
  f("drive.cardan.*", "— / °", "at the largest joint angle inside the lock: speed ratio max/min, peak-to-peak fluctuation U, cardan error °", "cardan-fluctuation"),
  f("envelope.travelMm[]", "mm", "+ bump, the grid's travels", "envelope"),
  f("envelope.steerInput[]", "mm or °", "the grid's input positions", "envelope"),
  f("envelope.jointAngleDeg[][]", "°", "[travel][input], left wheel, rounded to 1e-4°; null where the tie rod cannot reach", "envelope"),
  f("envelope.leftRoadWheelDeg[][]", "°", "+ left, rounded to 1e-4°", "envelope"),
  f("strength.motorTorqueNm", "N·m", "> 0", "shaft-torque"),
  f("strength.overallRatio", "—", "> 0, product of the stage ratios", "shaft-torque"),
  f("strength.shaftTorqueNmm", "N·mm", "> 0, worst-case share", "shaft-torque"),
  f("strength.shearStressMpa", "MPa", "> 0, at the neck surface", "shear-stress"),
  f("strength.allowableShearMpa", "MPa", "> 0; S_y/√3, printed: across-layer × derate", "allowable-shear"),
  f("strength.allowableSource", "—", "one line: the rule and the figure, each naming its citation key", "allowable-shear"),
  f("strength.allowableCitations[]", "—", "citation keys of the rule and the figure (anchors of /methods)", "allowable-shear"),
  f("strength.allowableCriterion", "—", "distortion-energy | tresca", "allowable-shear"),
  f("strength.allowableBasis", "—", "tensile-yield | across-layer-derated", "allowable-shear"),
  f("strength.safetyFactor", "—", "allowable / stress", "safety-factor"),
  f("strength.targetSafetyFactor", "—", "> 0, the designer's", "safety-factor"),
  f("strength.meetsTarget", "—", "safety factor ≥ target", "safety-factor"),
  f("strength.minimumNeckDiameterMm", "mm", "> 0, smallest neck (same bore) meeting the target", "safety-factor"),
  f("strength.neckWhatIf[].*", "mm, MPa, —", "the same check over neighbouring neck diameters", "safety-factor"),
  f("warnings[]", "—", "plain sentences naming the part", "result-document"),
];

function segmentsMatch(pattern: string, path: string): boolean {
  const p = pattern.split(".");
  const q = path.split(".");
  if (p.length !== q.length) return false;
  return p.every((s, i) => s === "*" || s === q[i]);
}

/** The table entry for a concrete result path ("steerLock.perTravel[].innerDeg"), or null. */
export function outputFieldFor(path: string): OutputField | null {
  return OUTPUT_FIELDS.find((x) => segmentsMatch(x.path, path)) ?? null;
}

/** The citation keys of an output field: its method entry's. */
export function outputFieldCitations(field: OutputField): readonly string[] {
  return methodByKey(field.method).cites;
}

/** The README's table of outputs, in Markdown: field, unit, sign, the methods entry and its citation keys. */
export function outputFieldsMarkdown(methodsUrl = "/methods"): string {
  const esc = (t: string) => t.replaceAll("|", "\\|");
  const lines = ["| field | unit | sign and meaning | method (on the methods page) | sources (citation keys) |", "|---|---|---|---|---|"];
  for (const x of OUTPUT_FIELDS) {
    const m = methodByKey(x.method);
    lines.push(`| \`${x.path}\` | ${esc(x.unit)} | ${esc(x.sign)} | [${esc(m.title)}](${methodsUrl}#${m.key}) | ${m.cites.map((c) => `\`${c}\``).join(", ")} |`);
  }
  return lines.join("\n");
}

export { METHOD_ENTRIES };
