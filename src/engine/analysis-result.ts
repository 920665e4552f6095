/**
 * The shape of one analysis (analyzeLayout). Every field name carries its unit (Mm, Deg, DegPerMm, Pct,
 * Nmm, Mpa); signs follow DESIGN.md and are listed field by field in OUTPUT_FIELDS (output-fields.ts).
 * Plain JSON: numbers are always finite; a figure that does not exist at a point is null, never NaN.
 */
import type { SteerAxisFigures } from "./steering/steer-axis";
import type { StrengthResult } from "./strength/index";
import type { JointType } from "./kit-layout";

/** What stops the wheel steering further at one travel. */
export type SteerLimitReason = "neck-contact" | "slot-limit" | "rated-angle" | "linkage" | "rack-travel";

/** One solved travel position (front view, rack centred). */
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

/** One rack position at static ride height. */
export interface SteerStepResult {
  readonly rackMm: number;
  readonly leftKnuckleRotationDeg: number;
  readonly leftRoadWheelDeg: number;
  readonly rightRoadWheelDeg: number;
  readonly leftCamberDeg: number;
  readonly rightCamberDeg: number;
  readonly leftJointAngleDeg: number;
  readonly rightJointAngleDeg: number;
  /** Inner and outer road-wheel angles of the turn this rack position makes, both + in that turn. */
  readonly innerDeg: number;
  readonly outerDeg: number;
  readonly ackermannTurnCentrePct: number | null;
  readonly ackermannInnerRefPct: number | null;
  readonly ackermannOuterRefPct: number | null;
}

/** Steer lock at one travel: how far the rack can move in one direction before something binds. */
export interface SteerLockResult {
  readonly travelMm: number;
  /** Rack displacement at lock for a left turn, mm (sign as the rack moves; the right turn mirrors it). */
  readonly rackMm: number;
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
  /** Largest joint angle over the whole grid (full rack travel at every travel step). */
  readonly maxJointAngleDeg: number;
  readonly maxJointAngleAtTravelMm: number;
  readonly maxJointAngleAtRackMm: number;
  /** Largest joint angle inside the usable envelope (each travel's steer lock). */
  readonly maxJointAngleWithinLockDeg: number;
  /** jointLimitDeg − maxJointAngleWithinLockDeg. */
  readonly jointMarginDeg: number;
  /** Neck-to-rim gap at maxJointAngleWithinLockDeg, (D/2)cos β − a sin β − d/2; null for a slotted cup. */
  readonly minNeckClearanceMm: number | null;
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

/** Joint angle and road-wheel angle over travel × rack; null where the tie rod cannot reach. */
export interface EnvelopeResult {
  readonly travelMm: readonly number[];
  readonly rackMm: readonly number[];
  /** [travel index][rack index], left wheel; the right wheel at rack s equals the left at −s. */
  readonly jointAngleDeg: readonly (readonly (number | null)[])[];
  readonly leftRoadWheelDeg: readonly (readonly (number | null)[])[];
}

export interface AnalysisResult {
  readonly resultSchema: 1;
  readonly grid: { readonly travelSteps: number; readonly steerSteps: number };
  readonly travel: readonly TravelStepResult[];
  /** The same figures at ride height (travel 0), whether or not the grid has a step there. */
  readonly atStatic: TravelStepResult;
  readonly steerAxis: SteerAxisResult;
  readonly steering: {
    /** +1 when a rack move to +y turns the car left, −1 when it turns it right. */
    readonly leftTurnRackSign: 1 | -1;
    readonly tieRodLengthMm: number;
    readonly steps: readonly SteerStepResult[];
  };
  readonly ackermann: {
    readonly convention: "turn-centre (cot δo − cot δi)/(w/L) × 100";
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
  readonly drive: DriveResult;
  readonly envelope: EnvelopeResult;
  readonly strength: StrengthResult;
  readonly warnings: readonly string[];
}
