/**
 * The shape of one analysis (analyzeLayout). Every field name carries its unit (Mm, Deg, DegPerMm, Pct,
 * Nmm, Mpa); signs follow DESIGN.md and are listed field by field in OUTPUT_FIELDS (output-fields.ts).
 * Plain JSON: numbers are always finite; a figure that does not exist at a point is null, never NaN.
 */
import type { SteerAxisFigures } from "./steering/steer-axis";
import type { StrengthResult } from "./strength/index";
import type { JointType } from "./kit-layout";

/**
 * What stops the wheel steering further at one travel: the drive joint (the neck meeting the cup mouth, the
 * end of the cup's slot, the joint's rated angle), the tie rod going over centre (toggle: in line with the
 * steering arm, so the input can go no further), or simply the end of the input's travel.
 */
export type SteerLimitReason = "neck-contact" | "slot-limit" | "rated-angle" | "toggle" | "input-travel";

/** The steering input as the analysis used it; positions are in its unit (mm for a rack, degrees for a bellcrank). */
export interface SteerInputResult {
  readonly kind: "rack" | "bellcrank";
  readonly unit: "mm" | "deg";
  /** Travel each way from centre, in `unit`. */
  readonly travel: number;
}

/** One solved travel position (front view, steering input centred: "straight ahead" at this travel, bump steer included). */
export interface TravelStepResult {
  readonly travelMm: number;
  readonly lowerArmAngleDeg: number;
  readonly upperArmAngleDeg: number;
  readonly camberDeg: number;
  readonly camberGainDegPerMm: number;
  readonly trackChangeMm: number;
  readonly contactPatchYMm: number;
  readonly contactPatchZMm: number;
  readonly instantCentreYMm: number | null;
  readonly instantCentreZMm: number | null;
  readonly rollCentreHeightMm: number | null;
  readonly kingpinInclinationDeg: number;
  readonly scrubRadiusMm: number;
  readonly bumpSteerDeg: number;
  readonly plungeMm: number;
  readonly jointAngleDeg: number;
}

/** One steering-input position at static ride height. */
export interface SteerStepResult {
  /** Rack mm or bellcrank degrees (steering.input.unit); + moves the inner ball to +y (rack) or turns the bellcrank counter-clockwise. */
  readonly steerInput: number;
  readonly leftKnuckleRotationDeg: number;
  readonly leftRoadWheelDeg: number;
  readonly rightRoadWheelDeg: number;
  readonly leftCamberDeg: number;
  readonly rightCamberDeg: number;
  readonly leftJointAngleDeg: number;
  readonly rightJointAngleDeg: number;
  /** Inner and outer road-wheel angles of the turn this input position makes, both + in that turn. */
  readonly innerDeg: number;
  readonly outerDeg: number;
  readonly ackermannTurnCentrePct: number | null;
  readonly ackermannInnerRefPct: number | null;
  readonly ackermannOuterRefPct: number | null;
}

/**
 * Steer lock at one travel: how far the input can move in one direction before something binds. The lock
 * is one input position for both wheels, set by whichever wheel binds first (the outer wheel can set it).
 */
export interface SteerLockResult {
  readonly travelMm: number;
  /** Input position at lock for a left turn (rack mm or bellcrank degrees, signed as the input moves; the right turn mirrors it). */
  readonly steerInput: number;
  readonly innerDeg: number;
  readonly outerDeg: number;
  /** The larger of the two wheels' joint angles at lock. */
  readonly jointAngleDeg: number;
  readonly limitedBy: SteerLimitReason;
}

/** The static steer-axis figures (documented field by field on SteerAxisFigures) plus the kingpin track. */
export type SteerAxisResult = Omit<SteerAxisFigures, "groundPoint"> & { readonly kingpinTrackMm: number };

export interface DriveResult {
  readonly jointType: JointType;
  readonly ratedAngleDeg: number;
  /** Neck-to-mouth contact angle (REFERENCES §8.1); null for a slotted cup. */
  readonly neckContactAngleDeg: number | null;
  readonly slotLimitDeg: number | null;
  /** The smaller of the cup's limit and the rated angle. */
  readonly jointLimitDeg: number;
  readonly jointLimitBy: "neck-contact" | "slot-limit" | "rated-angle";
  readonly shaftLengthStaticMm: number;
  readonly staticJointAngleDeg: number;
  /** Largest joint angle over the whole grid (full input travel at every travel step). */
  readonly maxJointAngleDeg: number;
  readonly maxJointAngleAtTravelMm: number;
  readonly maxJointAngleAtSteerInput: number;
  /** Largest joint angle inside the usable envelope (each travel's steer lock). */
  readonly maxJointAngleWithinLockDeg: number;
  /** jointLimitDeg − maxJointAngleWithinLockDeg. */
  readonly jointMarginDeg: number;
  readonly plungeMinMm: number;
  readonly plungeMaxMm: number;
  /** For joints whose output speed fluctuates, at maxJointAngleWithinLockDeg (REFERENCES §1.1); else null. */
  readonly cardan: {
    readonly atJointAngleDeg: number;
    readonly maxRatio: number;
    readonly minRatio: number;
    readonly fluctuation: number;
    readonly cardanErrorDeg: number;
  } | null;
}

/** Joint angle and road-wheel angle over travel × steering input; null where the tie rod cannot reach. */
export interface EnvelopeResult {
  readonly travelMm: readonly number[];
  /** Input positions, rack mm or bellcrank degrees, from full one way to full the other. */
  readonly steerInput: readonly number[];
  /** [travel index][input index], left wheel; the right wheel at input q equals the left at −q. */
  readonly jointAngleDeg: readonly (readonly (number | null)[])[];
  readonly leftRoadWheelDeg: readonly (readonly (number | null)[])[];
}

/**
 * The steering stop the layout needs: the input position (per side) at which a stop must sit so that no
 * travel position passes the binding limit (neck contact, slot, rated angle, toggle), and the margins the
 * proposed stop leaves. Positions are in the input's unit, signed for the turn they limit.
 */
export interface SteeringStopResult {
  /** "needed": the input travels past a limit; "not-needed": the end of its travel comes first; "no-position": the joint is past its limit with the wheels straight at some travel, so no stop can help. */
  readonly status: "needed" | "not-needed" | "no-position";
  /** What binds first at the worst travel ("input-travel" when no stop is needed). */
  readonly limitedBy: SteerLimitReason;
  /** The travel at which the limit comes earliest along the input (mm, + bump). */
  readonly worstTravelMm: number;
  /** Where the binding limit is reached at the worst travel: the furthest a stop may sit, left turn (the end of travel when no stop is needed). */
  readonly limitInput: number;
  readonly limitInnerDeg: number;
  readonly limitOuterDeg: number;
  /** The proposed stop, left turn: set back from limitInput so the inner wheel at the worst travel turns marginDeg less. */
  readonly leftTurnStopInput: number;
  /** The proposed stop for a right turn: the mirror, −leftTurnStopInput. */
  readonly rightTurnStopInput: number;
  /** The set-back asked for, degrees of inner road-wheel angle (the layout's stopMarginDeg, 1 when absent). */
  readonly marginDeg: number;
  /** Inner and outer road-wheel angles at the proposed stop, at the worst travel. */
  readonly stopInnerDeg: number;
  readonly stopOuterDeg: number;
  /** The largest joint angle of either wheel at the proposed stop over the whole travel range. */
  readonly jointAngleAtStopDeg: number;
  /** jointLimitDeg − jointAngleAtStopDeg: the angle still free before contact (or the rated angle). */
  readonly angleMarginDeg: number;
  /** Neck-to-mouth gap at jointAngleAtStopDeg, (D/2)cos β − a sin β − d/2; null for a slotted cup. */
  readonly clearanceAtStopMm: number | null;
  /** How far the present input travel runs past limitInput (≥ 0; 0 when no stop is needed). */
  readonly overrun: number;
  /** Where the tie rod goes over centre within the present travel (left turn, at the travel where it comes first), or null when it does not. */
  readonly toggle: { readonly steerInput: number; readonly travelMm: number } | null;
}

export interface AnalysisResult {
  readonly resultSchema: 2;
  readonly grid: { readonly travelSteps: number; readonly steerSteps: number };
  readonly travel: readonly TravelStepResult[];
  /** The same figures at ride height (travel 0), whether or not the grid has a step there. */
  readonly atStatic: TravelStepResult;
  readonly steerAxis: SteerAxisResult;
  readonly steering: {
    readonly input: SteerInputResult;
    /** +1 when a + input move (rack to +y, bellcrank counter-clockwise) turns the car left, −1 when it turns it right. */
    readonly leftTurnInputSign: 1 | -1;
    readonly tieRodLengthMm: number;
    readonly steps: readonly SteerStepResult[];
  };
  readonly ackermann: {
    readonly convention: "turn-centre (cot δo − cot δi)/(w/L) × 100";
    /** Below this inner or outer angle the percentages are null (0/0 near straight ahead), degrees. */
    readonly minReportingAngleDeg: number;
    readonly atLockPct: number | null;
    readonly innerRefAtLockPct: number | null;
    readonly outerRefAtLockPct: number | null;
    readonly kingpinTrackMm: number;
    readonly wheelbaseMm: number;
  };
  readonly steerLock: {
    /** The smallest lock over the travel range (what the car can rely on). */
    readonly worst: SteerLockResult;
    readonly static: SteerLockResult;
    readonly perTravel: readonly SteerLockResult[];
  };
  readonly steeringStop: SteeringStopResult;
  readonly drive: DriveResult;
  readonly envelope: EnvelopeResult;
  readonly strength: StrengthResult;
  readonly warnings: readonly string[];
}
