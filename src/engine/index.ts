/**
 * The engine's one import path. Pure TypeScript geometry for the left front corner of a small car
 * (ISO 8855 axes, mm and degrees); the right corner mirrors it.
 */
export { analyzeLayout, ANALYZE_LIMITS, materialFigure, type AnalyzeOptions } from "./analyze";
export { allowableShear, analyzeStrength, calibrateAllowable, type Calibration, type CalibrationRun, type CalibrationStatus, type StrengthResult, type TestOutcome } from "./strength/index";
export type * from "./analysis-result";
export type * from "./kit-layout";
export type * from "./geometry-types";
export { GeometryError } from "./errors";
export { OUTPUT_FIELDS, type OutputField } from "./output-fields";
export type { Vec3 } from "./math/vec3";
export type { Vec2 } from "./math/vec2";
export { cornerPoser, cornerPoseAt, wheelAxesMeet, type CornerPose, type CornerPoser, type WheelPose } from "./corner-pose";
export { cupArticulationLimit, neckClearanceMm } from "./drive/neck-contact";
export { MATERIALS } from "./strength/materials";
export { DRIVE_JOINT_TYPES, type DriveJointType } from "./drive/joint-types";
export {
  neckTradeoff,
  neckTradeoffRangeMm,
  NECK_TRADEOFF_GRID,
  NECK_TRADEOFF_RANGE,
  NECK_TRADEOFF_SAMPLES,
  type NeckTradeoff,
  type NeckTradeoffGap,
  type NeckTradeoffOptions,
  type NeckTradeoffPoint,
  type NeckTradeoffSample,
} from "./neck-tradeoff";
export { ackermannIdealOuterDeg } from "./steering/ackermann";
