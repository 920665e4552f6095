import { z } from "zod";
import type { Layout } from "./layout";
import { JOINT_TYPES } from "./layout";
import { TARGET_KEYS, targetsSchema, type ReadoutKey, type Readouts, type Targets } from "./targets";

// A design search: from one kit's layout, the figures that may move (each within a range, or among a few
// choices), the aims (the targets' six figures) and what to prefer among the layouts that meet them. The
// search runs as batches of analyses on background workers; its answer is stored with its question.

/** A figure the designer may let move: where it lives in the layout and the widest range it may take. */
export interface SearchNumberFigure {
  readonly kind: "number";
  readonly key: string;
  readonly label: string;
  readonly unit: "mm" | "°";
  /** The widest range a question may ask for (the layout document's own bounds, narrowed to what is sensible). */
  readonly limit: readonly [number, number];
  /** Only for layouts this applies to (a rack's travel is not a bellcrank's). */
  readonly appliesTo?: (l: Layout) => boolean;
  readonly get: (l: Layout) => number;
  readonly set: (l: Layout, v: number) => Layout;
}

export interface SearchChoiceFigure {
  readonly kind: "choice";
  readonly key: string;
  readonly label: string;
  /** Every choice a question may offer. */
  readonly options: readonly string[];
  readonly get: (l: Layout) => string;
  readonly set: (l: Layout, v: string) => Layout;
}

export type SearchFigure = SearchNumberFigure | SearchChoiceFigure;

/** The catalogue materials a search may try (the engine's list; ids as the layout stores them). */
export const SEARCH_MATERIALS = [
  "aisi-4140-annealed",
  "aisi-4140-normalized",
  "aisi-4140-qt-650",
  "aisi-4140-qt-540",
  "aisi-4140-qt-425",
  "aisi-1045-cold-drawn-annealed",
  "jis-s45c-normalized-min",
  "jis-s45c-qt-min",
  "al-7075-t6",
  "pla-fff",
  "petg-fff",
  "pa12-cf-fff-annealed",
  "pa12-cf-sls",
] as const;

const drive = (l: Layout, d: Partial<Layout["drive"]>): Layout => ({ ...l, drive: { ...l.drive, ...d } });
const top = (l: Layout, t: Partial<Layout["topView"]>): Layout => ({ ...l, topView: { ...l.topView, ...t } });
const isRack = (l: Layout) => l.topView.steeringInput.kind === "rack";

export const SEARCH_FIGURES: readonly SearchFigure[] = [
  { kind: "number", key: "neckDiameterMm", label: "Neck diameter", unit: "mm", limit: [1, 20], get: (l) => l.drive.neckDiameterMm, set: (l, v) => drive(l, { neckDiameterMm: v }) },
  { kind: "number", key: "boreDiameterMm", label: "Neck bore", unit: "mm", limit: [0, 15], get: (l) => l.drive.boreDiameterMm ?? 0, set: (l, v) => drive(l, { boreDiameterMm: v }) },
  { kind: "number", key: "cupMouthDiameterMm", label: "Cup mouth", unit: "mm", limit: [2, 30], get: (l) => l.drive.cupMouthDiameterMm, set: (l, v) => drive(l, { cupMouthDiameterMm: v }) },
  { kind: "number", key: "pivotDepthMm", label: "Pivot depth", unit: "mm", limit: [0, 15], get: (l) => l.drive.pivotDepthMm, set: (l, v) => drive(l, { pivotDepthMm: v }) },
  { kind: "choice", key: "jointType", label: "Joint kind", options: JOINT_TYPES, get: (l) => l.drive.jointType, set: (l, v) => drive(l, { jointType: v as Layout["drive"]["jointType"] }) },
  { kind: "number", key: "ratedAngleDeg", label: "Rated joint angle", unit: "°", limit: [5, 60], get: (l) => l.drive.ratedAngleDeg, set: (l, v) => drive(l, { ratedAngleDeg: v }) },
  {
    kind: "choice",
    key: "material",
    label: "Material",
    options: SEARCH_MATERIALS,
    get: (l) => (l.strength.material.kind === "catalogue" ? l.strength.material.id : "custom"),
    set: (l, v) => ({ ...l, strength: { ...l.strength, material: { kind: "catalogue", id: v } } }),
  },
  { kind: "number", key: "steeringArmBallX", label: "Steering arm ball x", unit: "mm", limit: [-80, 80], get: (l) => l.topView.steeringArmBall.x, set: (l, v) => top(l, { steeringArmBall: { ...l.topView.steeringArmBall, x: v } }) },
  { kind: "number", key: "steeringArmBallY", label: "Steering arm ball y", unit: "mm", limit: [0, 300], get: (l) => l.topView.steeringArmBall.y, set: (l, v) => top(l, { steeringArmBall: { ...l.topView.steeringArmBall, y: v } }) },
  { kind: "number", key: "tieRodInnerX", label: "Rack end x", unit: "mm", limit: [-80, 80], get: (l) => l.topView.tieRodInner.x, set: (l, v) => top(l, { tieRodInner: { ...l.topView.tieRodInner, x: v } }) },
  { kind: "number", key: "tieRodInnerY", label: "Rack end y", unit: "mm", limit: [0, 300], get: (l) => l.topView.tieRodInner.y, set: (l, v) => top(l, { tieRodInner: { ...l.topView.tieRodInner, y: v } }) },
  { kind: "number", key: "outboardJointY", label: "Outboard joint y", unit: "mm", limit: [0, 300], get: (l) => l.drive.outboardJoint.y, set: (l, v) => drive(l, { outboardJoint: { ...l.drive.outboardJoint, y: v } }) },
  { kind: "number", key: "outboardJointZ", label: "Outboard joint z", unit: "mm", limit: [0, 300], get: (l) => l.drive.outboardJoint.z, set: (l, v) => drive(l, { outboardJoint: { ...l.drive.outboardJoint, z: v } }) },
  {
    kind: "number",
    key: "rackTravelMm",
    label: "Rack travel",
    unit: "mm",
    limit: [0.5, 30],
    appliesTo: isRack,
    get: (l) => (l.topView.steeringInput.kind === "rack" ? l.topView.steeringInput.travelMm : 0),
    set: (l, v) => (l.topView.steeringInput.kind === "rack" ? top(l, { steeringInput: { kind: "rack", travelMm: v } }) : l),
  },
  {
    kind: "number",
    key: "bellcrankTravelDeg",
    label: "Bellcrank travel",
    unit: "°",
    limit: [0.5, 80],
    appliesTo: (l) => !isRack(l),
    get: (l) => (l.topView.steeringInput.kind === "bellcrank" ? l.topView.steeringInput.travelDeg : 0),
    set: (l, v) => (l.topView.steeringInput.kind === "bellcrank" ? top(l, { steeringInput: { ...l.topView.steeringInput, travelDeg: v } }) : l),
  },
];

export const SEARCH_FIGURE_KEYS = SEARCH_FIGURES.map((f) => f.key);
export function searchFigure(key: string): SearchFigure | undefined {
  return SEARCH_FIGURES.find((f) => f.key === key);
}

export const SEARCH_PREFERENCES = ["most-lock", "strongest", "least-change"] as const;
export type SearchPreference = (typeof SEARCH_PREFERENCES)[number];
export const PREFERENCE_LABELS: Record<SearchPreference, string> = {
  "most-lock": "Most steer lock",
  strongest: "Strongest (highest safety factor)",
  "least-change": "Least change from the current layout",
};

/** Largest sample a question may ask for: with the refinement, a few seconds of work per worker. */
export const SEARCH_SAMPLES_MAX = 4096;
export const SEARCH_SAMPLES_DEFAULT = 384;

const finite = (name: string) => z.number({ error: `${name} must be a number` }).refine(Number.isFinite, { error: `${name} must be a number` });

const rangeMove = z.strictObject({ key: z.string({ error: "key must be text" }), min: finite("min"), max: finite("max") });
const choiceMove = z.strictObject({
  key: z.string({ error: "key must be text" }),
  choices: z.array(z.string({ error: "choices must be text" })).min(1, "Give at least one choice").max(20, "At most 20 choices"),
});

/** POST …/kits/{k}/searches: what may move, the aims and the preference. */
export const searchQuestionSchema = z
  .strictObject({
    moves: z.array(z.union([rangeMove, choiceMove], { error: "Each move is { key, min, max } or { key, choices }" })).min(1, "Pick at least one figure that may move").max(SEARCH_FIGURES.length, "Too many figures"),
    aims: targetsSchema,
    prefer: z.enum(SEARCH_PREFERENCES, { error: `prefer must be one of ${SEARCH_PREFERENCES.join(", ")}` }),
    samples: z.number({ error: "samples must be a number" }).int("samples must be a whole number").min(16, "samples must be at least 16").max(SEARCH_SAMPLES_MAX, `samples must be at most ${SEARCH_SAMPLES_MAX}`).optional(),
  })
  .superRefine((q, ctx) => {
    const seen = new Set<string>();
    q.moves.forEach((m, i) => {
      const f = searchFigure(m.key);
      if (!f) return ctx.addIssue({ code: "custom", path: ["moves", i, "key"], message: `moves[${i}].key must be one of ${SEARCH_FIGURE_KEYS.join(", ")}` });
      if (seen.has(m.key)) ctx.addIssue({ code: "custom", path: ["moves", i, "key"], message: `${f.label} is listed twice` });
      seen.add(m.key);
      if (f.kind === "number") {
        if (!("min" in m)) return ctx.addIssue({ code: "custom", path: ["moves", i], message: `${f.label} takes a range: { key, min, max }` });
        if (!(m.min < m.max)) ctx.addIssue({ code: "custom", path: ["moves", i, "min"], message: `${f.label}: the least value must be below the greatest` });
        if (m.min < f.limit[0] || m.max > f.limit[1]) ctx.addIssue({ code: "custom", path: ["moves", i, m.min < f.limit[0] ? "min" : "max"], message: `${f.label} may range within ${f.limit[0]} – ${f.limit[1]} ${f.unit}` });
      } else {
        if (!("choices" in m)) return ctx.addIssue({ code: "custom", path: ["moves", i], message: `${f.label} takes choices: { key, choices }` });
        m.choices.forEach((c, j) => {
          if (!f.options.includes(c)) ctx.addIssue({ code: "custom", path: ["moves", i, "choices", j], message: `${f.label}: “${c.slice(0, 40)}” is not one of ${f.options.join(", ")}` });
        });
      }
    });
  });
export type SearchQuestion = z.infer<typeof searchQuestionSchema>;
export type SearchMove = SearchQuestion["moves"][number];

/** The figures' values of one layout, by figure key. */
export type FigureValues = Record<string, number | string>;

/** One analysed layout of a search: where it sits in the space and its key readouts. */
export interface SearchCandidate {
  /** The moved figures' values. */
  readonly values: FigureValues;
  readonly readouts: Readouts;
  /** How far it misses each aim it misses (≥ 0; by the aim's key, in the aim's unit). */
  readonly shortfalls: Partial<Record<AimKey, number>>;
  /** Sum of the shortfalls, each over its aim's scale: 0 when every aim is met. */
  readonly violation: number;
  /** Distance from the current layout: the moved figures' changes over their ranges (0 – number of figures). */
  readonly change: number;
}

/** The aims as the answer names them (the targets' keys, the Ackermann range as two). */
export type AimKey = (typeof TARGET_KEYS)[number];

export const SEARCH_STATUSES = ["running", "done", "cancelled", "failed"] as const;
export type SearchStatus = (typeof SEARCH_STATUSES)[number];

/** What a finished search found. */
export interface SearchAnswer {
  /** "met": at least one layout meets every aim; "not-met": none does, and `failing` says which and by how much. */
  readonly outcome: "met" | "not-met";
  /** The current layout's place (the same figures and readouts). */
  readonly current: SearchCandidate;
  /** The best few by the preference (when met), else the nearest (least total shortfall). */
  readonly best: readonly SearchCandidate[];
  /** The non-dominated layouts of steer lock against safety factor (meeting the other aims where any do), by lock. */
  readonly front: readonly SearchCandidate[];
  /** When not met: each aim the nearest layout misses, with the amount, and the best any layout reached. */
  readonly failing: readonly { readonly aim: AimKey; readonly shortfall: number; readonly bestReached: number | null }[];
  readonly tried: number;
  readonly valid: number;
}

/** A search as the API answers it. */
export interface SearchView {
  readonly id: string;
  readonly kitId: string;
  readonly baseRevision: number;
  readonly status: SearchStatus;
  readonly phase: "sample" | "refine" | "finished";
  readonly question: SearchQuestion;
  readonly tried: number;
  readonly planned: number;
  readonly best: SearchCandidate | null;
  readonly answer: SearchAnswer | null;
  readonly error: string | null;
  readonly createdByName: string | null;
  readonly createdAt: string;
  readonly updatedAt: string;
  readonly finishedAt: string | null;
}

/** The layout a candidate describes: the base with its moved figures set. */
export function applyFigures(base: Layout, values: FigureValues): Layout {
  let l = base;
  for (const [key, v] of Object.entries(values)) {
    const f = searchFigure(key);
    if (!f) continue;
    l = f.kind === "number" ? f.set(l, Number(v)) : f.set(l, String(v));
  }
  // A bore of (near) nothing is a solid neck: keep the document as a designer would write it.
  if (l.drive.boreDiameterMm !== undefined && l.drive.boreDiameterMm < 0.05) {
    const solid: Layout["drive"] = { ...l.drive };
    delete solid.boreDiameterMm;
    l = { ...l, drive: solid };
  }
  return l;
}

/** The readout an aim judges, and which way it must lie. */
export const AIM_READOUT: Record<AimKey, { readout: ReadoutKey; at: "least" | "most" }> = {
  minLockDeg: { readout: "lockDeg", at: "least" },
  maxJointAngleDeg: { readout: "maxJointAngleDeg", at: "most" },
  minSafetyFactor: { readout: "safetyFactor", at: "least" },
  ackermannMinPct: { readout: "ackermannPct", at: "least" },
  ackermannMaxPct: { readout: "ackermannPct", at: "most" },
  minNeckClearanceMm: { readout: "neckClearanceMm", at: "least" },
};

/** How much of each aim's unit counts as one unit of shortfall when aims are weighed together. */
export const AIM_SCALE: Record<AimKey, number> = { minLockDeg: 1, maxJointAngleDeg: 1, minSafetyFactor: 0.25, ackermannMinPct: 10, ackermannMaxPct: 10, minNeckClearanceMm: 0.1 };

/**
 * How far `r` misses each aim (only the aims it misses). A figure the layout does not have: a slotted cup
 * has no neck clearance to judge (no shortfall), Ackermann with too little steer to tell misses its range
 * by the whole range's width.
 */
export function aimShortfalls(r: Readouts, aims: Targets): Partial<Record<AimKey, number>> {
  const out: Partial<Record<AimKey, number>> = {};
  for (const aim of TARGET_KEYS) {
    const { readout, at } = AIM_READOUT[aim];
    const v = r[readout];
    if (v === null) {
      if (readout === "ackermannPct") out[aim] = Math.max(AIM_SCALE[aim], aims.ackermannMaxPct - aims.ackermannMinPct);
      continue;
    }
    const s = at === "least" ? aims[aim] - v : v - aims[aim];
    if (s > 0) out[aim] = s;
  }
  return out;
}

export function violationOf(shortfalls: Partial<Record<AimKey, number>>): number {
  let sum = 0;
  for (const [aim, s] of Object.entries(shortfalls) as [AimKey, number][]) sum += s / AIM_SCALE[aim];
  return sum;
}

/** Larger is better: the figure the preference ranks layouts that meet every aim by. */
export function preferenceScore(c: Pick<SearchCandidate, "readouts" | "change">, prefer: SearchPreference): number {
  switch (prefer) {
    case "most-lock":
      return c.readouts.lockDeg ?? -Infinity;
    case "strongest":
      return c.readouts.safetyFactor ?? -Infinity;
    case "least-change":
      return -c.change;
  }
}

/** Orders candidates best first: those meeting every aim by the preference, then the rest by least total shortfall. */
export function compareCandidates(a: SearchCandidate, b: SearchCandidate, prefer: SearchPreference): number {
  const am = a.violation === 0;
  const bm = b.violation === 0;
  if (am !== bm) return am ? -1 : 1;
  if (!am) return a.violation - b.violation || a.change - b.change;
  return preferenceScore(b, prefer) - preferenceScore(a, prefer) || a.change - b.change;
}

/** One moved figure of a candidate against the current layout. */
export interface FigureChange {
  readonly key: string;
  readonly label: string;
  readonly from: string;
  readonly to: string;
}

function figureText(key: string, v: number | string | undefined): string {
  const f = searchFigure(key);
  if (v === undefined) return "—";
  if (!f || f.kind === "choice") return String(v);
  const n = Number(v);
  return `${Number.isInteger(n) ? n : n.toFixed(2)}${f.unit === "°" ? "°" : ` ${f.unit}`}`;
}

/** The figures a candidate moves away from the current layout (those it leaves alone are not listed). */
export function changesOf(current: FigureValues, values: FigureValues): FigureChange[] {
  const out: FigureChange[] = [];
  for (const [key, v] of Object.entries(values)) {
    const was = current[key];
    if (was === v || (typeof v === "number" && typeof was === "number" && Math.abs(v - was) < 0.005)) continue;
    out.push({ key, label: searchFigure(key)?.label ?? key, from: figureText(key, was), to: figureText(key, v) });
  }
  return out;
}

/** The revision note of a layout kept from a search: which search, which of its layouts, what changed. */
export function searchNote(searchId: string, rank: number, changes: readonly FigureChange[]): string {
  const what = changes.length > 0 ? changes.map((c) => `${c.label} ${c.from} → ${c.to}`).join("; ") : "no figure changed";
  return `From design search ${searchId.slice(0, 8)}, layout ${rank} of its best: ${what}`.slice(0, 500);
}
