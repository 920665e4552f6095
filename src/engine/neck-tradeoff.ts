/**
 * The neck trade-off: how steer lock and shaft strength move together as the neck diameter changes, the
 * rest of the layout held. A thinner neck articulates further before it meets the cup mouth (REFERENCES
 * §8.1: dβ/dd < 0), so the steer lock rises or holds; it carries the same torque on a smaller section,
 * τ_max = 16 T / (π d³) solid, 16 T D / (π (D⁴ − b⁴)) hollow (Shigley, torsion of round bars; REFERENCES §6.1),
 * so the safety factor falls. Each sample is one analyzeLayout on a coarse grid: the figures at a sample
 * are exactly analyzeLayout's for the layout with that neck (steer lock = steerLock.worst, safety factor
 * = strength.safetyFactor). A diameter the engine refuses (GeometryError) is a gap, never a NaN.
 */
import type { SteerLimitReason } from "./analysis-result";
import { analyzeLayout, ANALYZE_LIMITS, type AnalyzeOptions } from "./analyze";
import { GeometryError } from "./errors";
import type { KitLayout } from "./kit-layout";

/** Grid of each sample's analysis: the editor's coarse grid (about 0.7 ms an analysis for the demo kit). */
export const NECK_TRADEOFF_GRID = { travelSteps: 9, steerSteps: 15 } as const;

/** How many evenly stepped diameters a trade-off asks for (the current neck is added to them). */
export const NECK_TRADEOFF_SAMPLES = { min: 5, max: 41, default: 21 } as const;

/**
 * The range swept, as fractions of the cup mouth diameter D:
 * - up to D·(1 − 0.05): at d = D the neck cannot articulate at all (the engine refuses d ≥ D), and the
 *   last few percent only show the lock collapsing to zero;
 * - down to D·0.35: below about a third of the mouth the contact angle is already near its thin-neck limit
 *   atan(D / 2a) (REFERENCES §8.1), so the rated angle or the linkage binds and the lock stops changing
 *   while the strength keeps falling as d³ — a thinner neck buys nothing there;
 * - never below the bore plus a wall of 0.25 mm each side (a hollow neck needs a wall; common practice,
 *   value from memory), nor below 0.3 mm (the layout contract's smallest neck).
 * The current neck is always inside the range (the range is widened to it if need be).
 */
export const NECK_TRADEOFF_RANGE = { mouthFractionMin: 0.35, mouthFractionMax: 0.95, minWallMm: 0.25, minNeckMm: 0.3 } as const;

/** Sample steps in mm, finest first: the finest that keeps the count within the samples asked for. */
const NICE_STEPS_MM = [0.01, 0.02, 0.05, 0.1, 0.2, 0.25, 0.3, 0.4, 0.5, 1, 2, 5, 10] as const;

export interface NeckTradeoffOptions {
  /** Most evenly stepped diameters wanted, 5–41 (default 21); the step is a round 0.01, 0.02, 0.05, 0.1, … mm. */
  readonly samples?: number;
  /** Grid of each sample's analysis (default NECK_TRADEOFF_GRID). */
  readonly grid?: AnalyzeOptions;
  /** Diameters to sample instead of the range, mm (at most 41; the current neck is added). */
  readonly diametersMm?: readonly number[];
}

/** One neck diameter analysed. */
export interface NeckTradeoffPoint {
  readonly ok: true;
  readonly neckDiameterMm: number;
  /** Worst steer lock over travel (steerLock.worst.innerDeg), degrees, + steering further. */
  readonly steerLockDeg: number;
  /** The outer wheel's angle at that lock, degrees. */
  readonly steerLockOuterDeg: number;
  readonly limitedBy: SteerLimitReason;
  /** The joint's limit with this neck (cup against rated angle), degrees. */
  readonly jointLimitDeg: number;
  /** strength.safetyFactor, dimensionless, > 0. */
  readonly safetyFactor: number;
  readonly meetsTarget: boolean;
}

/** A diameter the engine refused: the part and reason of its GeometryError. */
export interface NeckTradeoffGap {
  readonly ok: false;
  readonly neckDiameterMm: number;
  readonly part: string;
  readonly reason: string;
}

export type NeckTradeoffSample = NeckTradeoffPoint | NeckTradeoffGap;

export interface NeckTradeoff {
  readonly grid: { readonly travelSteps: number; readonly steerSteps: number };
  /** Ascending diameter, mm; one of them is the current neck. */
  readonly samples: readonly NeckTradeoffSample[];
  readonly currentNeckMm: number;
  /** Index in `samples` of the current neck. */
  readonly currentIndex: number;
  readonly targetSafetyFactor: number;
  /** Smallest neck (same bore and material) that meets the target, mm; null when every sample is a gap. */
  readonly minimumNeckDiameterMm: number | null;
  readonly rangeMm: { readonly min: number; readonly max: number };
  /** Sample step, mm; null when the diameters were given. */
  readonly stepMm: number | null;
}

/** Rounds to 1e-6 mm so stepped diameters print and compare cleanly (3·0.1 = 0.3, not 0.30000000000000004). */
const roundMm = (v: number) => Math.round(v * 1e6) / 1e6;

function checkedSamples(n: number | undefined): number {
  const lim = NECK_TRADEOFF_SAMPLES;
  const v = n ?? lim.default;
  if (!Number.isInteger(v) || v < lim.min || v > lim.max) throw new GeometryError("neck trade-off", `samples must be a whole number from ${lim.min} to ${lim.max} (got ${String(n)})`);
  return v;
}

/** The swept range for a layout, mm (see NECK_TRADEOFF_RANGE). */
export function neckTradeoffRangeMm(layout: KitLayout): { min: number; max: number } {
  const d = layout.drive;
  const r = NECK_TRADEOFF_RANGE;
  const bore = d.boreDiameterMm ?? 0;
  const min = Math.max(r.mouthFractionMin * d.cupMouthDiameterMm, bore > 0 ? bore + 2 * r.minWallMm : 0, r.minNeckMm);
  const max = r.mouthFractionMax * d.cupMouthDiameterMm;
  return { min: Math.min(min, d.neckDiameterMm), max: Math.max(max, d.neckDiameterMm) };
}

/** Evenly stepped diameters on multiples of a round step across [min, max], at most `samples` of them. */
function steppedDiameters(min: number, max: number, samples: number): { stepMm: number; diameters: number[] } {
  const count = (s: number) => Math.floor(max / s + 1e-9) - Math.ceil(min / s - 1e-9) + 1;
  const step = NICE_STEPS_MM.find((s) => count(s) <= samples) ?? NICE_STEPS_MM[NICE_STEPS_MM.length - 1];
  const first = Math.ceil(min / step - 1e-9);
  const last = Math.floor(max / step + 1e-9);
  const diameters: number[] = [];
  for (let k = first; k <= last; k++) diameters.push(roundMm(k * step));
  return { stepMm: step, diameters };
}

type Grid = { readonly travelSteps: number; readonly steerSteps: number };

function checkedGrid(grid: AnalyzeOptions | undefined): Grid {
  const g = { travelSteps: grid?.travelSteps ?? NECK_TRADEOFF_GRID.travelSteps, steerSteps: grid?.steerSteps ?? NECK_TRADEOFF_GRID.steerSteps };
  for (const key of ["travelSteps", "steerSteps"] as const) {
    const lim = ANALYZE_LIMITS[key];
    if (!Number.isInteger(g[key]) || g[key] < lim.min || g[key] > lim.max) {
      throw new GeometryError("analysis grid", `${key} must be a whole number from ${lim.min} to ${lim.max} (got ${String(g[key])})`);
    }
  }
  return g;
}

/** One diameter analysed, and the strength module's minimum neck (the same for every diameter). */
function sampleAt(layout: KitLayout, neckMm: number, grid: Grid): { sample: NeckTradeoffSample; minimumNeckMm: number | null } {
  try {
    const a = analyzeLayout({ ...layout, drive: { ...layout.drive, neckDiameterMm: neckMm } }, grid);
    const sample: NeckTradeoffPoint = {
      ok: true,
      neckDiameterMm: neckMm,
      steerLockDeg: a.steerLock.worst.innerDeg,
      steerLockOuterDeg: a.steerLock.worst.outerDeg,
      limitedBy: a.steerLock.worst.limitedBy,
      jointLimitDeg: a.drive.jointLimitDeg,
      safetyFactor: a.strength.safetyFactor,
      meetsTarget: a.strength.meetsTarget,
    };
    return { sample, minimumNeckMm: a.strength.minimumNeckDiameterMm };
  } catch (error) {
    if (error instanceof GeometryError) return { sample: { ok: false, neckDiameterMm: neckMm, part: error.part, reason: error.reason }, minimumNeckMm: null };
    throw error;
  }
}

/**
 * Steer lock and shaft safety factor over neck diameter for `layout` (see the module comment), with the
 * current neck and the target safety factor. Diameters in mm, ascending; the current neck is always a
 * sample. Throws GeometryError only for bad options (samples or grid out of range, too many diameters).
 */
export function neckTradeoff(layout: KitLayout, options: NeckTradeoffOptions = {}): NeckTradeoff {
  const grid = checkedGrid(options.grid);
  const current = layout.drive.neckDiameterMm;
  let diameters: number[];
  let stepMm: number | null;
  if (options.diametersMm) {
    if (options.diametersMm.length > NECK_TRADEOFF_SAMPLES.max) throw new GeometryError("neck trade-off", `at most ${NECK_TRADEOFF_SAMPLES.max} diameters`);
    const bad = options.diametersMm.find((d) => !Number.isFinite(d));
    if (bad !== undefined) throw new GeometryError("neck trade-off", `diameters must be finite numbers of mm (got ${String(bad)})`);
    diameters = options.diametersMm.map(roundMm);
    stepMm = null;
  } else {
    const range = neckTradeoffRangeMm(layout);
    ({ stepMm, diameters } = steppedDiameters(range.min, range.max, checkedSamples(options.samples)));
  }
  if (!diameters.some((d) => Math.abs(d - current) < 1e-9)) diameters.push(current);
  diameters = [...new Set(diameters)].sort((a, b) => a - b);
  const currentIndex = diameters.findIndex((d) => Math.abs(d - current) < 1e-9);

  // The current neck is analysed as given (not as rounded), so its sample is analyzeLayout's own figures.
  const analysed = diameters.map((d, i) => sampleAt(layout, i === currentIndex ? current : d, grid));
  const samples = analysed.map((a) => a.sample);
  // Independent of the neck's own diameter (same torque, bore, material and target).
  const minimumNeckDiameterMm = analysed.find((a) => a.minimumNeckMm !== null)?.minimumNeckMm ?? null;
  return {
    grid,
    samples,
    currentNeckMm: current,
    currentIndex,
    targetSafetyFactor: layout.strength.targetSafetyFactor,
    minimumNeckDiameterMm,
    rangeMm: { min: diameters[0], max: diameters[diameters.length - 1] },
    stepMm,
  };
}
