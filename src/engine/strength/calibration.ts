/**
 * How well did the safety factors predict what happened? From logged test runs of one material, the factor
 * on the material's allowable shear that would have put the failure line (safety factor 1) between the runs
 * that held and the runs that broke.
 *
 * Definitions. Each run i has a predicted safety factor n_i = S_sy / τ_i (dimensionless, > 0) computed with
 * the material's present figure S_sy, and an outcome: held, worn or broke. Scaling the allowable by k scales
 * every prediction by k (n = S_sy/τ is linear in S_sy: Shigley's Mechanical Engineering Design 9th ed.
 * §5-5; REFERENCES §6.1). The runs are consistent with k when every held run predicts ≥ 1 and every broken
 * run < 1, i.e. 1/n_held,min ≤ k < 1/n_broke,max — possible only when n_broke,max < n_held,min. Within that
 * range the factor given is the one that puts the line midway between the two runs on a logarithmic scale,
 * k = 1/√(n_held,min · n_broke,max) — a choice of ours (an equal ratio of margin to either run), not a
 * published rule. Worn runs (survived, damaged) are reported but bound nothing: they are neither clear
 * survivals nor failures.
 *
 * A factor below 1 derates the material (the runs broke at higher predicted factors than 1); above 1, the
 * material did better than its figure. Runs are evidence of the test conditions only: the factor is as good
 * as the runs (loads, print settings, batches) are like the use to come.
 */

export type TestOutcome = "held" | "worn" | "broke";

export interface CalibrationRun {
  /** Predicted safety factor with the material's present figure, > 0. */
  readonly safetyFactor: number;
  readonly outcome: TestOutcome;
}

export type CalibrationStatus =
  /** Held and broken runs separate: `factor` puts the line between them. */
  | "separated"
  /** Some broken run predicted at least as high as some held run: no single factor separates them. */
  | "overlap"
  /** Runs of one side only (or none): the line is bounded on one side at most. */
  | "one-sided";

export interface Calibration {
  readonly status: CalibrationStatus;
  readonly runs: number;
  readonly held: number;
  readonly worn: number;
  readonly broke: number;
  /** Lowest predicted factor among held runs; null without one. */
  readonly lowestHeld: number | null;
  /** Highest predicted factor among broken runs; null without one. */
  readonly highestBroke: number | null;
  /** The factor on the allowable (status "separated" only), else null. */
  readonly factor: number | null;
  /** Every k in [min, max) keeps the runs consistent (status "separated" only). */
  readonly factorRange: { readonly min: number; readonly max: number } | null;
}

/**
 * The calibration of a material from its runs (see the module comment). Runs with a non-finite or
 * non-positive factor are skipped (they carry no prediction). Never throws; never returns NaN.
 */
export function calibrateAllowable(runs: readonly CalibrationRun[]): Calibration {
  const usable = runs.filter((r) => Number.isFinite(r.safetyFactor) && r.safetyFactor > 0);
  const of = (o: TestOutcome) => usable.filter((r) => r.outcome === o).map((r) => r.safetyFactor);
  const held = of("held");
  const broke = of("broke");
  const lowestHeld = held.length ? Math.min(...held) : null;
  const highestBroke = broke.length ? Math.max(...broke) : null;
  const counts = { runs: usable.length, held: held.length, worn: of("worn").length, broke: broke.length, lowestHeld, highestBroke };
  if (lowestHeld === null || highestBroke === null) return { status: "one-sided", ...counts, factor: null, factorRange: null };
  if (highestBroke >= lowestHeld) return { status: "overlap", ...counts, factor: null, factorRange: null };
  return {
    status: "separated",
    ...counts,
    factor: 1 / Math.sqrt(lowestHeld * highestBroke),
    factorRange: { min: 1 / lowestHeld, max: 1 / highestBroke },
  };
}
