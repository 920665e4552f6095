/**
 * Every output of analyzeLayout with its unit, sign convention and the source of its formula, for the
 * README and the API docs. Paths use [] for array items. Provenance tags follow REFERENCES.md:
 * [F] found, [M] from memory, [D] derived, [C] common practice.
 */
export interface OutputField {
  readonly path: string;
  readonly unit: string;
  readonly sign: string;
  readonly source: string;
}

const FV = "front-view four-bar, closed form (Norton, Design of Machinery 5th ed. ch. 4 [M]; REFERENCES §3)";
const RC = "IC from the extended arm lines; RC where the contact-patch–IC line crosses the centreline (REFERENCES §4.1 [F] suspensionsecrets, [D])";
const STEER = "knuckle rotated about the kingpin axis by Rodrigues' formula; tie rod of fixed length (REFERENCES §5.3 [D])";
const ACK = "REFERENCES §2.2 (Jazar ch. 7 [M], Milliken ch. 19 [M])";

export const OUTPUT_FIELDS: readonly OutputField[] = [
  { path: "atStatic", unit: "—", sign: "every travel[] figure at ride height (travel 0)", source: "as travel[]" },
  { path: "travel[].travelMm", unit: "mm", sign: "+ bump (wheel centre up relative to the body), − droop", source: "input grid" },
  { path: "travel[].lowerArmAngleDeg", unit: "°", sign: "+ outer end higher than inner, front view", source: FV },
  { path: "travel[].upperArmAngleDeg", unit: "°", sign: "+ outer end higher than inner, front view", source: FV },
  { path: "travel[].camberDeg", unit: "°", sign: "+ wheel top leans outboard (relative to the body)", source: FV },
  { path: "travel[].camberGainDegPerMm", unit: "°/mm", sign: "dγ/dz per mm of wheel-centre travel; − = top moves inboard in bump", source: "−1/(y_wheel − y_IC) rad/mm (REFERENCES §4.1 [D])" },
  { path: "travel[].trackChangeMm", unit: "mm", sign: "+ wider (both sides in heave)", source: "contact centre of a rigid tyre of the given radius [C]" },
  { path: "travel[].contactPatchYMm", unit: "mm", sign: "+ left (outboard on the left corner)", source: "wheel centre − radius along the wheel plane's up direction [C]" },
  { path: "travel[].contactPatchZMm", unit: "mm", sign: "+ up; the ground under the wheel at this travel", source: "as above" },
  { path: "travel[].instantCentreYMm", unit: "mm", sign: "+ left; null when the arms are parallel (IC at infinity)", source: RC },
  { path: "travel[].instantCentreZMm", unit: "mm", sign: "+ up; null when the arms are parallel", source: RC },
  { path: "travel[].rollCentreHeightMm", unit: "mm", sign: "+ above the ground under the wheel at this travel (DESIGN.md)", source: RC },
  { path: "travel[].kingpinInclinationDeg", unit: "°", sign: "+ axis top leans inboard", source: "SAE J670 / ISO 8855 terms [M]; REFERENCES §5.1" },
  { path: "travel[].scrubRadiusMm", unit: "mm", sign: "+ axis meets the ground inboard of the contact centre", source: "Barton & Fieldhouse §3.1.5.3 [F]; REFERENCES §5.1" },
  { path: "travel[].bumpSteerDeg", unit: "°", sign: "+ left (toe-out on the left wheel), rack centred", source: STEER },
  { path: "travel[].plungeMm", unit: "mm", sign: "+ the joint centres move apart (shaft must extend)", source: "change of |outboard − inboard joint centre| [C]" },
  { path: "travel[].jointAngleDeg", unit: "°", sign: "≥ 0, bend between shaft and stub axle, rack centred", source: "atan2(|s × w|, s·w) (REFERENCES §1.5 [D])" },
  { path: "steerAxis.kingpinInclinationDeg", unit: "°", sign: "+ axis top leans inboard", source: "REFERENCES §5.1" },
  { path: "steerAxis.casterDeg", unit: "°", sign: "+ axis top leans rearward", source: "REFERENCES §5.1" },
  { path: "steerAxis.scrubRadiusMm", unit: "mm", sign: "+ axis ground point inboard of the contact centre", source: "REFERENCES §5.1–5.2 [F]/[D]" },
  { path: "steerAxis.casterTrailMm", unit: "mm", sign: "+ axis meets the ground ahead of the contact centre", source: "REFERENCES §5.1–5.2 [F]/[D]" },
  { path: "steerAxis.hubOffsetMm", unit: "mm", sign: "+ axis inboard of the wheel centre at hub height", source: "Barton & Fieldhouse §3.1.5.4 [F]" },
  { path: "steerAxis.spindleLengthMm", unit: "mm", sign: "+ foot of the common perpendicular inboard of the wheel centre", source: "REFERENCES §5.1 [M]" },
  { path: "steerAxis.spindleOffsetMm", unit: "mm", sign: "≥ 0, common perpendicular of spin and steering axes", source: "REFERENCES §5.1 [M]" },
  { path: "steerAxis.kingpinTrackMm", unit: "mm", sign: "> 0, between the two axes' ground points", source: "REFERENCES §2.1" },
  { path: "steering.leftTurnRackSign", unit: "—", sign: "+1 when moving the rack to +y turns the car left", source: STEER },
  { path: "steering.tieRodLengthMm", unit: "mm", sign: "> 0, from the static layout", source: "input geometry" },
  { path: "steering.steps[].rackMm", unit: "mm", sign: "+ rack towards +y (left)", source: "input grid" },
  { path: "steering.steps[].leftKnuckleRotationDeg", unit: "°", sign: "+ left, about the upward kingpin axis", source: STEER },
  { path: "steering.steps[].leftRoadWheelDeg", unit: "°", sign: "+ left: heading of the wheel's forward vector in the ground plane", source: STEER },
  { path: "steering.steps[].rightRoadWheelDeg", unit: "°", sign: "+ left; mirror of the left wheel at −rack", source: STEER },
  { path: "steering.steps[].leftCamberDeg", unit: "°", sign: "+ top outboard (exact, with steer)", source: "REFERENCES §5.3 [D]" },
  { path: "steering.steps[].rightCamberDeg", unit: "°", sign: "+ top outboard", source: "REFERENCES §5.3 [D]" },
  { path: "steering.steps[].leftJointAngleDeg", unit: "°", sign: "≥ 0", source: "REFERENCES §1.5 [D]" },
  { path: "steering.steps[].rightJointAngleDeg", unit: "°", sign: "≥ 0", source: "REFERENCES §1.5 [D]" },
  { path: "steering.steps[].innerDeg", unit: "°", sign: "+ in the turn being made (inner wheel)", source: STEER },
  { path: "steering.steps[].outerDeg", unit: "°", sign: "+ in the turn being made (outer wheel)", source: STEER },
  { path: "steering.steps[].ackermannTurnCentrePct", unit: "%", sign: "P_cot: 100 = axes meet on the rear axle line, 0 = parallel, − = reverse; null below 0.5°", source: ACK },
  { path: "steering.steps[].ackermannInnerRefPct", unit: "%", sign: "P_in (inner wheel as reference), shown beside P_cot", source: ACK },
  { path: "steering.steps[].ackermannOuterRefPct", unit: "%", sign: "P_out (outer wheel as reference), shown beside P_cot", source: ACK },
  { path: "ackermann.atLockPct", unit: "%", sign: "P_cot at static steer lock", source: ACK },
  { path: "ackermann.innerRefAtLockPct", unit: "%", sign: "P_in at static steer lock", source: ACK },
  { path: "ackermann.outerRefAtLockPct", unit: "%", sign: "P_out at static steer lock", source: ACK },
  { path: "steerLock.worst / static / perTravel[].rackMm", unit: "mm", sign: "rack displacement at lock for a left turn (right turn mirrors)", source: "Brent root of the binding limit along the rack" },
  { path: "steerLock.*.innerDeg", unit: "°", sign: "+ inner road-wheel angle at lock", source: STEER },
  { path: "steerLock.*.outerDeg", unit: "°", sign: "+ outer road-wheel angle at lock", source: STEER },
  { path: "steerLock.*.jointAngleDeg", unit: "°", sign: "larger joint angle of the two wheels at lock", source: "REFERENCES §1.5 [D]" },
  { path: "steerLock.*.limitedBy", unit: "—", sign: "neck-contact | slot-limit | rated-angle | linkage | rack-travel", source: "—" },
  { path: "drive.neckContactAngleDeg", unit: "°", sign: "articulation where the neck meets the mouth; null for a slotted cup", source: "REFERENCES §8.1 [D]" },
  { path: "drive.jointLimitDeg", unit: "°", sign: "min(cup limit, rated angle)", source: "REFERENCES §1.6, §8" },
  { path: "drive.maxJointAngleDeg", unit: "°", sign: "largest over the full grid", source: "REFERENCES §1.5 [D]" },
  { path: "drive.maxJointAngleWithinLockDeg", unit: "°", sign: "largest inside each travel's steer lock", source: "REFERENCES §1.5 [D]" },
  { path: "drive.jointMarginDeg", unit: "°", sign: "+ spare angle to the limit inside the lock", source: "—" },
  { path: "drive.minNeckClearanceMm", unit: "mm", sign: "+ clear, 0 touching; null for a slotted cup", source: "(D/2)cos β − a sin β − d/2, REFERENCES §8.1 [D]" },
  { path: "drive.plungeMinMm / plungeMaxMm", unit: "mm", sign: "+ joint centres apart, over the whole envelope", source: "[C]" },
  { path: "drive.cardan.*", unit: "— / °", sign: "speed ratio max/min, peak-to-peak fluctuation U, cardan error", source: "REFERENCES §1.1 (Simscape Driveline page [F], Uicker et al. [M], [D])" },
  { path: "envelope.jointAngleDeg[][]", unit: "°", sign: "[travel][rack], left wheel, rounded to 1e-4°; null where the tie rod cannot reach", source: "REFERENCES §1.5 [D]" },
  { path: "envelope.leftRoadWheelDeg[][]", unit: "°", sign: "+ left, rounded to 1e-4°", source: STEER },
  { path: "strength.shaftTorqueNmm", unit: "N·mm", sign: "> 0, worst-case share", source: "REFERENCES §6.2 [C]/[F]" },
  { path: "strength.shearStressMpa", unit: "MPa", sign: "> 0, at the neck surface", source: "16T/(πd³) (Shigley ch. 3 [M]; amesweb [F])" },
  { path: "strength.allowableShearMpa", unit: "MPa", sign: "> 0; S_y/√3, printed: across-layer × derate", source: "Shigley 9th ed. §5-5 [F]" },
  { path: "strength.safetyFactor", unit: "—", sign: "allowable / stress", source: "REFERENCES §6.1" },
  { path: "warnings[]", unit: "—", sign: "plain sentences naming the part", source: "—" },
];
