import { z } from "zod";
import type { Calibration } from "@/engine";
import { confirmedKits } from "./shelf";
import type { TestOutcome } from "./test-log";
import { PG_INTEGER_MAX } from "./text";

// How good were the predictions, per shelf material: every logged run's predicted safety factor (re-judged
// with the material's present figure) against its outcome, and the derate that would put the failure line
// (safety factor 1) between the runs that held and the runs that broke.

export interface CalibrationPoint {
  readonly runId: string;
  readonly kitId: string;
  readonly kitName: string;
  readonly runNumber: number;
  readonly revision: number;
  readonly testedOn: string;
  readonly part: string;
  readonly outcome: TestOutcome;
  readonly failureLocation: string;
  /** With the material's figure of today: allowable / τ of the run's set-up. */
  readonly safetyFactor: number;
  /** As predicted when the run was logged (the figure of that day), null when it could not be solved. */
  readonly loggedSafetyFactor: number | null;
}

export interface CalibrationProposal {
  /** The material's derate now and after applying the factor. */
  readonly derateNow: number;
  readonly derateAfter: number;
  /** False when the result cannot be a derate (it would exceed 1 or fall below 0.01): `reason` says why. */
  readonly applicable: boolean;
  readonly reason: string | null;
  /** The source the new figure would carry. */
  readonly source: string;
}

export interface MaterialCalibration {
  readonly material: { readonly id: string; readonly name: string; readonly version: number; readonly printed: boolean; readonly derate: number; readonly derateSource: string };
  readonly allowableShearMpa: number;
  readonly points: readonly CalibrationPoint[];
  readonly calibration: Calibration;
  readonly proposal: CalibrationProposal | null;
}

const DERATE_MIN = 0.01;

/** The derate a factor gives, rounded to 4 decimals (the figure people read and type). */
export function calibratedDerate(derateNow: number, factor: number): number {
  return Math.round(derateNow * factor * 10_000) / 10_000;
}

/** The proposal for a calibration, or null when there is no factor to apply. */
export function proposalFor(c: Calibration, derateNow: number, on: string): CalibrationProposal | null {
  if (c.factor === null) return null;
  const derateAfter = calibratedDerate(derateNow, c.factor);
  const source =
    `calibrated from ${c.runs} test runs (${on}): lowest safety factor that held ${c.lowestHeld!.toFixed(2)}, highest that broke ${c.highestBroke!.toFixed(2)}; ` +
    `factor ${c.factor.toFixed(3)} on the derate ${derateNow}`;
  if (derateAfter > 1) {
    return { derateNow, derateAfter, applicable: false, reason: `The runs say this material is stronger than its figure (the derate would be ${derateAfter.toFixed(3)}, above 1). A derate cannot raise a figure: change the yield figure itself if its source supports it.`, source };
  }
  if (derateAfter < DERATE_MIN) {
    return { derateNow, derateAfter, applicable: false, reason: `The derate would be ${derateAfter.toFixed(4)}, below ${DERATE_MIN}: check the runs' set-ups before trusting it.`, source };
  }
  return { derateNow, derateAfter, applicable: true, reason: null, source };
}

/** POST …/calibration/{materialId}: what the person saw (so a run logged meanwhile asks again) and the kits confirmed. */
export const calibrationApplyBody = z.strictObject({
  version: z.number({ error: "version must be the shelf material's version" }).int().min(1).max(PG_INTEGER_MAX - 1),
  runs: z.number({ error: "runs must be the number of runs the factor came from" }).int().min(2).max(PG_INTEGER_MAX),
  derate: z.number({ error: "derate must be the derate shown" }).min(DERATE_MIN).max(1),
  kits: confirmedKits.optional(),
});
export type CalibrationApplyBody = z.infer<typeof calibrationApplyBody>;
