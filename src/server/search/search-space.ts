// The space a design search walks, and the work of one batch: a space-filling sample (a shifted Halton
// sequence) or a local refinement (Nelder–Mead, from the fmin package) around one start. Pure: the engine
// and the contracts only, so a worker process, a test or the bench can run it.
import { nelderMead } from "fmin/index.js";
import {
  aimShortfalls,
  applyFigures,
  compareCandidates,
  searchFigure,
  violationOf,
  type FigureValues,
  type SearchAnswer,
  type SearchCandidate,
  type SearchChoiceFigure,
  type SearchNumberFigure,
  type SearchQuestion,
} from "@/contracts/design-search";
import { parseLayout, type Layout } from "@/contracts/layout";
import { summarizeAnalysis } from "@/contracts/revisions";
import { TARGET_KEYS, type Readouts } from "@/contracts/targets";
import { analyzeLayout, type KitLayout } from "@/engine";

type NumberDim = { figure: SearchNumberFigure; min: number; max: number };
type ChoiceDim = { figure: SearchChoiceFigure; choices: readonly string[] };

export interface SearchSpace {
  readonly base: Layout;
  readonly question: SearchQuestion;
  readonly numbers: readonly NumberDim[];
  readonly choices: readonly ChoiceDim[];
  /** The current layout's values of the moved figures. */
  readonly baseValues: FigureValues;
  /** A per-search shift of the sample (from its id), so two searches of one question do not share points. */
  readonly shift: readonly number[];
}

/** How many layouts a sample batch analyses (a few hundred milliseconds of work). */
export const SAMPLE_BATCH = 48;
/** How many starts the refinement takes (the best of the sample, each a batch), and its analyses per start. */
export const REFINE_STARTS = 4;
export const REFINE_BUDGET = 60;

const PRIMES = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53, 59, 61];

/** The radical inverse of i in base b: the Halton sequence's coordinate (van der Corput). */
function radicalInverse(i: number, b: number): number {
  let f = 1;
  let r = 0;
  while (i > 0) {
    f /= b;
    r += f * (i % b);
    i = Math.floor(i / b);
  }
  return r;
}

/** A number in [0, 1) from a text, for the sample's shift (FNV-1a). */
function hashUnit(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h / 2 ** 32;
}

/**
 * The space of a question from a layout; a move naming a figure this layout does not have (a rack's travel
 * on a bellcrank layout) is an error naming it.
 */
export function searchSpace(base: Layout, question: SearchQuestion, seed: string): SearchSpace {
  const numbers: NumberDim[] = [];
  const choices: ChoiceDim[] = [];
  const baseValues: FigureValues = {};
  question.moves.forEach((m, i) => {
    const figure = searchFigure(m.key);
    if (!figure) throw new SearchSpaceError(`moves[${i}].key`, `unknown figure ${m.key}`);
    if (figure.kind === "number") {
      if (figure.appliesTo && !figure.appliesTo(base)) throw new SearchSpaceError(`moves[${i}].key`, `${figure.label} does not apply to this layout`);
      if (!("min" in m)) throw new SearchSpaceError(`moves[${i}]`, `${figure.label} takes a range`);
      numbers.push({ figure, min: m.min, max: m.max });
      baseValues[m.key] = figure.get(base);
    } else {
      if (!("choices" in m)) throw new SearchSpaceError(`moves[${i}]`, `${figure.label} takes choices`);
      choices.push({ figure, choices: [...new Set(m.choices)] });
      baseValues[m.key] = figure.get(base);
    }
  });
  const dims = numbers.length + choices.length;
  const shift = Array.from({ length: dims }, (_, d) => hashUnit(`${seed}:${d}`));
  return { base, question, numbers, choices, baseValues, shift };
}

export class SearchSpaceError extends Error {
  constructor(
    readonly path: string,
    readonly reason: string,
  ) {
    super(`${path}: ${reason}`);
  }
}

/** The figures' values at point `u` of the unit cube (numbers first, then choices). */
export function valuesAt(space: SearchSpace, u: readonly number[]): FigureValues {
  const values: FigureValues = {};
  space.numbers.forEach((d, i) => {
    const t = Math.min(1, Math.max(0, u[i]!));
    // Two decimals: what a drawing would give, and what the editor shows.
    values[d.figure.key] = Math.round((d.min + t * (d.max - d.min)) * 100) / 100;
  });
  space.choices.forEach((d, j) => {
    const t = Math.min(0.999999, Math.max(0, u[space.numbers.length + j]!));
    values[d.figure.key] = d.choices[Math.floor(t * d.choices.length)]!;
  });
  return values;
}

/** Point `index` of the search's sample: the Halton sequence, shifted modulo 1 (Cranley–Patterson). */
export function samplePoint(space: SearchSpace, index: number): number[] {
  return space.shift.map((s, d) => (radicalInverse(index + 1, PRIMES[d % PRIMES.length]!) + s) % 1);
}

/** How far `values` is from the current layout: each moved figure's change over its range, summed. */
export function changeOf(space: SearchSpace, values: FigureValues): number {
  let c = 0;
  for (const d of space.numbers) c += Math.abs(Number(values[d.figure.key]) - Number(space.baseValues[d.figure.key])) / (d.max - d.min);
  for (const d of space.choices) c += values[d.figure.key] === space.baseValues[d.figure.key] ? 0 : 1;
  return c;
}

/** The key readouts of one layout, or null when it cannot be built or analysed. */
export function readoutsOfLayout(layout: Layout): Readouts | null {
  const parsed = parseLayout(layout);
  if (!parsed.ok) return null;
  try {
    const s = summarizeAnalysis(analyzeLayout(parsed.layout as KitLayout));
    return { lockDeg: s.lockDeg, maxJointAngleDeg: s.maxJointAngleDeg, ackermannPct: s.ackermannPct, safetyFactor: s.safetyFactor, neckClearanceMm: s.neckClearanceMm };
  } catch {
    return null; // impossible geometry (GeometryError): not a layout
  }
}

/** One layout of the space analysed and judged against the aims; null when it cannot be built. */
export function evaluate(space: SearchSpace, values: FigureValues): SearchCandidate | null {
  const readouts = readoutsOfLayout(applyFigures(space.base, values));
  if (!readouts) return null;
  const shortfalls = aimShortfalls(readouts, space.question.aims);
  return { values, readouts, shortfalls, violation: violationOf(shortfalls), change: changeOf(space, values) };
}

export function currentCandidate(space: SearchSpace): SearchCandidate | null {
  return evaluate(space, space.baseValues);
}

/** What one batch did: how many layouts it tried, and those that could be analysed. */
export interface BatchResult {
  readonly tried: number;
  readonly candidates: SearchCandidate[];
}

/** Sample points [from, from + count): `keepGoing` is asked every few layouts (a cancelled search stops). */
export async function runSampleBatch(space: SearchSpace, from: number, count: number, keepGoing: () => Promise<boolean>): Promise<BatchResult | null> {
  const candidates: SearchCandidate[] = [];
  for (let i = 0; i < count; i++) {
    if (i % 16 === 15 && !(await keepGoing())) return null;
    const c = evaluate(space, valuesAt(space, samplePoint(space, from + i)));
    if (c) candidates.push(c);
  }
  return { tried: count, candidates };
}

class BudgetSpent extends Error {}

/** The unit-cube coordinates of a candidate's number figures. */
function unitOf(space: SearchSpace, values: FigureValues): number[] {
  return space.numbers.map((d) => (Number(values[d.figure.key]) - d.min) / (d.max - d.min));
}

/**
 * Nelder–Mead (fmin) around `start`, over the number figures (its choices held), for at most `budget`
 * analyses. It minimises the total shortfall, weighted far above the preference, so it first reaches the aims
 * and then, among layouts that meet them, goes where the preference points.
 */
export function runRefineBatch(space: SearchSpace, start: FigureValues, budget: number): BatchResult {
  const candidates: SearchCandidate[] = [];
  const seen = new Map<string, number>();
  let tried = 0;
  if (space.numbers.length === 0) return { tried, candidates };
  const held = Object.fromEntries(space.choices.map((d) => [d.figure.key, start[d.figure.key]!]));
  const objective = (v: number[]): number => {
    const u = v.map((x) => x - 1);
    const values: FigureValues = { ...valuesAt(space, [...u, ...space.choices.map(() => 0)]), ...held };
    const key = JSON.stringify(values);
    const known = seen.get(key);
    if (known !== undefined) return known;
    if (tried >= budget) throw new BudgetSpent();
    tried++;
    const c = evaluate(space, values);
    // Outside the cube (clamped back in) costs a little, so the simplex turns round at the walls.
    const outside = u.reduce((s, x) => s + Math.max(0, -x, x - 1), 0);
    let f: number;
    if (!c) f = 1e6 + outside;
    else {
      candidates.push(c);
      f = 100 * c.violation + outside * 10 - preferenceWeight(space, c);
    }
    seen.set(key, f);
    return f;
  };
  // Coordinates offset by 1, so fmin's first simplex (each coordinate × (1 + step)) steps a share of each
  // range. fmin 0.0.4's shrink step refers to an undeclared variable (a ReferenceError in its ES module), so
  // sigma = 1 has it stop where it would shrink; the shrink is done here instead, as a restart from the best
  // point with half the step.
  let x0 = unitOf(space, start).map((x) => x + 1);
  let step = 0.15;
  try {
    while (tried < budget && step > 0.005) {
      const found = nelderMead(objective, x0, { maxIterations: budget * 2, nonZeroDelta: 1 + step, zeroDelta: step, minErrorDelta: 1e-7, sigma: 1 });
      x0 = found.x.slice();
      step /= 2;
    }
  } catch (e) {
    if (!(e instanceof BudgetSpent)) throw e;
  }
  return { tried, candidates };
}

/** The preference as a figure of the same order as a unit of shortfall. */
function preferenceWeight(space: SearchSpace, c: SearchCandidate): number {
  switch (space.question.prefer) {
    case "most-lock":
      return c.readouts.lockDeg ?? 0;
    case "strongest":
      return (c.readouts.safetyFactor ?? 0) / 0.25;
    case "least-change":
      return -10 * c.change;
  }
}

/** The refinement's starts: the best few of the sample, distinct in their choices where they can be. */
export function refineStarts(space: SearchSpace, candidates: readonly SearchCandidate[], count = REFINE_STARTS): FigureValues[] {
  if (space.numbers.length === 0) return [];
  const sorted = [...candidates].sort((a, b) => compareCandidates(a, b, space.question.prefer));
  const starts: FigureValues[] = [];
  const choiceKey = (v: FigureValues) => space.choices.map((d) => v[d.figure.key]).join("|");
  const usedChoices = new Set<string>();
  for (const c of sorted) {
    if (starts.length >= count) break;
    if (usedChoices.has(choiceKey(c.values)) && starts.length < count - 1) continue;
    usedChoices.add(choiceKey(c.values));
    starts.push(c.values);
  }
  for (const c of sorted) {
    if (starts.length >= count) break;
    if (!starts.includes(c.values)) starts.push(c.values);
  }
  return starts;
}

/** The layouts no other beats on both steer lock and safety factor, by lock. */
export function nonDominated(candidates: readonly SearchCandidate[]): SearchCandidate[] {
  const pts = candidates.filter((c) => c.readouts.lockDeg !== null && c.readouts.safetyFactor !== null);
  // Most lock first; keep each that is stronger than every one with more lock.
  const sorted = [...pts].sort((a, b) => b.readouts.lockDeg! - a.readouts.lockDeg! || b.readouts.safetyFactor! - a.readouts.safetyFactor!);
  const front: SearchCandidate[] = [];
  let bestSf = -Infinity;
  for (const c of sorted) {
    if (c.readouts.safetyFactor! > bestSf) {
      front.push(c);
      bestSf = c.readouts.safetyFactor!;
    }
  }
  return front.reverse();
}

const FRONT_MAX = 40;
const BEST_MAX = 5;

/** Keeps at most `n`, evenly along the list (both ends kept). */
function thin<T>(list: readonly T[], n: number): T[] {
  if (list.length <= n) return [...list];
  return Array.from({ length: n }, (_, i) => list[Math.round((i * (list.length - 1)) / (n - 1))]!);
}

/** The aims the plot shows as its axes (lock and safety factor); the front is taken among layouts meeting the rest. */
const PLOTTED_AIMS = new Set(["minLockDeg", "minSafetyFactor"]);

/** The answer from every layout the search analysed. */
export function buildAnswer(space: SearchSpace, all: readonly SearchCandidate[], tried: number, current: SearchCandidate): SearchAnswer {
  const prefer = space.question.prefer;
  const sorted = [...all].sort((a, b) => compareCandidates(a, b, prefer));
  const met = sorted.filter((c) => c.violation === 0);
  const best = distinct(met.length > 0 ? met : sorted).slice(0, BEST_MAX);
  const meetsOthers = all.filter((c) => Object.keys(c.shortfalls).every((k) => PLOTTED_AIMS.has(k)));
  const front = thin(nonDominated(meetsOthers.length > 0 ? meetsOthers : all), FRONT_MAX);
  const failing: { aim: (typeof TARGET_KEYS)[number]; shortfall: number; bestReached: number | null }[] = [];
  if (met.length === 0 && best[0]) {
    for (const aim of TARGET_KEYS) {
      const s = best[0].shortfalls[aim];
      if (s === undefined) continue;
      failing.push({ aim, shortfall: s, bestReached: bestReached(all, aim, space) });
    }
  }
  return { outcome: met.length > 0 ? "met" : "not-met", current, best, front, failing, tried, valid: all.length };
}

/** The best value any layout reached for one aim's figure. */
function bestReached(all: readonly SearchCandidate[], aim: (typeof TARGET_KEYS)[number], space: SearchSpace): number | null {
  const least = (s: Partial<Record<string, number>>) => s[aim] ?? 0;
  let best: SearchCandidate | null = null;
  for (const c of all) if (!best || least(c.shortfalls) < least(best.shortfalls)) best = c;
  if (!best) return null;
  const readout = { minLockDeg: "lockDeg", maxJointAngleDeg: "maxJointAngleDeg", minSafetyFactor: "safetyFactor", ackermannMinPct: "ackermannPct", ackermannMaxPct: "ackermannPct", minNeckClearanceMm: "neckClearanceMm" } as const;
  void space;
  return best.readouts[readout[aim]];
}

/** Drops layouts whose values repeat one earlier in the list. */
function distinct(list: readonly SearchCandidate[]): SearchCandidate[] {
  const seen = new Set<string>();
  return list.filter((c) => {
    const k = JSON.stringify(c.values);
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}
