import { z } from "zod";
import type { TestOutcome } from "@/engine";
import type { AttachmentInfo } from "./attachments";
import { isStorableText, PG_INTEGER_MAX, storableTextMessage } from "./text";

// The test log: per kit revision, the runs made on the bench or the track with the set-up as tested, what
// happened and where, notes and photos, beside what the engine predicted for that set-up.

export const TEST_OUTCOMES = ["held", "worn", "broke"] as const satisfies readonly TestOutcome[];
export type { TestOutcome };

export const OUTCOME_LABELS: Record<TestOutcome, string> = { held: "held", worn: "worn", broke: "broke" };

function words(field: string, max: number, { required = false, multiLine = false } = {}) {
  const base = z
    .string({ error: `${field} must be text` })
    .trim()
    .max(max, { error: `${field} must be at most ${max} characters` })
    .refine((t) => isStorableText(t, multiLine), { error: storableTextMessage(field, multiLine) });
  return required ? base.refine((t) => t.length > 0, { error: `${field} is required` }) : base;
}

function figure(field: string, unit: string, min: number, max: number) {
  return z
    .number({ error: `${field} must be a number (${unit})` })
    .min(min, { error: `${field} must be at least ${min} ${unit}` })
    .max(max, { error: `${field} must be at most ${max} ${unit}` });
}

/** The motor as tested: a stall or peak torque, or a Kv rating with the current drawn. */
export const testedMotorSchema = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({ kind: z.literal("torque"), torqueNm: figure("setup.motor.torqueNm", "N·m", 0.001, 100) }),
    z.strictObject({
      kind: z.literal("kv"),
      kvRpmPerV: figure("setup.motor.kvRpmPerV", "rpm/V", 50, 50000),
      currentA: figure("setup.motor.currentA", "A", 0.1, 2000),
    }),
  ],
  { error: "setup.motor.kind must be torque or kv" },
);

export const testSetupSchema = z.strictObject({
  motor: testedMotorSchema,
  gearRatios: z
    .array(figure("setup.gearRatios[]", "(driven/driving)", 0.1, 100), { error: "setup.gearRatios must be a list of ratios" })
    .min(1, { error: "setup.gearRatios needs at least one ratio" })
    .max(6, { error: "setup.gearRatios takes at most 6 ratios" }),
  /** Inner-wheel steer lock the car ran at, degrees; null when not recorded. */
  lockDeg: figure("setup.lockDeg", "°", 0, 80).nullable(),
  /** What the part carried: car mass, surface, jumps, laps… in words. */
  load: words("setup.load", 200),
});
export type TestSetup = z.infer<typeof testSetupSchema>;

const isoDay = z
  .string({ error: "testedOn must be a date (YYYY-MM-DD)" })
  .regex(/^\d{4}-\d{2}-\d{2}$/, { error: "testedOn must be a date (YYYY-MM-DD)" })
  .refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d), { error: "testedOn is not a calendar date" })
  .refine((d) => d >= "2000-01-01", { error: "testedOn must be in 2000 or later" })
  // A day ahead of UTC is allowed: it is already tomorrow somewhere.
  .refine((d) => Date.parse(`${d}T00:00:00Z`) <= Date.now() + 86_400_000, { error: "testedOn must not be in the future" });

const runFields = {
  revision: z.number({ error: "revision must be a revision number" }).int({ error: "revision must be a whole number" }).min(1, { error: "revision starts at 1" }).max(PG_INTEGER_MAX, { error: "revision is too large" }),
  testedOn: isoDay,
  part: words("part", 120, { required: true }),
  materialId: z.string({ error: "materialId must be a shelf material id" }).uuid({ error: "materialId must be a shelf material id (a UUID)" }),
  setup: testSetupSchema,
  outcome: z.enum(TEST_OUTCOMES, { error: `outcome must be one of ${TEST_OUTCOMES.join(", ")}` }),
  /** Where it broke or wore: required for a broken part. */
  failureLocation: words("failureLocation", 200),
  notes: words("notes", 2000, { multiLine: true }),
};

const needsLocation = (b: { outcome?: TestOutcome; failureLocation?: string }) => b.outcome !== "broke" || (b.failureLocation ?? "").length > 0;
const locationIssue = { path: ["failureLocation"], message: "failureLocation is required for a part that broke: say where it broke" };

/** POST …/kits/{kitId}/test-runs */
export const testRunCreateBody = z
  .strictObject({ ...runFields, failureLocation: runFields.failureLocation.default(""), notes: runFields.notes.default("") })
  .refine(needsLocation, locationIssue);
export type TestRunCreateBody = z.infer<typeof testRunCreateBody>;

const version = z.number({ error: "version must be a number" }).int({ error: "version must be a whole number" }).min(1, { error: "version starts at 1" }).max(PG_INTEGER_MAX - 1, { error: "version is too large" });

/** PATCH …/test-runs/{runId}: the run's version and the fields that change (the revision stays). */
export const testRunPatchBody = z.strictObject({
  version,
  testedOn: runFields.testedOn.optional(),
  part: runFields.part.optional(),
  materialId: runFields.materialId.optional(),
  setup: runFields.setup.optional(),
  outcome: runFields.outcome.optional(),
  failureLocation: runFields.failureLocation.optional(),
  notes: runFields.notes.optional(),
});
export type TestRunPatchBody = z.infer<typeof testRunPatchBody>;

/** What the engine predicted for the run's set-up when it was logged. */
export type RunPrediction =
  | {
      readonly ok: true;
      readonly safetyFactor: number;
      readonly shearStressMpa: number;
      readonly allowableShearMpa: number;
      readonly shaftTorqueNmm: number;
      readonly allowableSource: string;
    }
  | { readonly ok: false; readonly reason: string };

export interface TestRun {
  readonly id: string;
  readonly kitId: string;
  readonly number: number;
  readonly revision: number;
  readonly testedOn: string;
  readonly part: string;
  readonly materialId: string | null;
  readonly materialName: string;
  readonly setup: TestSetup;
  readonly outcome: TestOutcome;
  readonly failureLocation: string;
  readonly notes: string;
  readonly prediction: RunPrediction | null;
  readonly photos: readonly AttachmentInfo[];
  readonly version: number;
  readonly createdByName: string | null;
  readonly createdAt: string;
}

/** `1.4` for a safety factor (two significant decimals below 10). */
export function formatSafetyFactor(n: number): string {
  return n >= 10 ? n.toFixed(1) : n.toFixed(2);
}

/** "runs 1, 2 and 4" / "run 3". */
export function runList(numbers: readonly number[]): string {
  const sorted = [...numbers].sort((a, b) => a - b);
  if (sorted.length === 1) return `run ${sorted[0]}`;
  return `runs ${sorted.slice(0, -1).join(", ")} and ${sorted[sorted.length - 1]}`;
}

/**
 * One line per predicted factor: the prediction beside what happened, e.g. "predicted safety factor 1.40 —
 * broke in run 3". Runs with the same prediction (same set-up and material) share a line; newest first.
 */
export function predictionLines(runs: readonly Pick<TestRun, "number" | "outcome" | "prediction">[]): string[] {
  const groups = new Map<string, { sf: number | null; outcomes: Map<TestOutcome, number[]>; newest: number }>();
  for (const r of runs) {
    const sf = r.prediction?.ok ? r.prediction.safetyFactor : null;
    const key = sf === null ? "none" : formatSafetyFactor(sf);
    const g = groups.get(key) ?? { sf, outcomes: new Map(), newest: 0 };
    g.outcomes.set(r.outcome, [...(g.outcomes.get(r.outcome) ?? []), r.number]);
    g.newest = Math.max(g.newest, r.number);
    groups.set(key, g);
  }
  return [...groups.values()]
    .sort((a, b) => b.newest - a.newest)
    .map((g) => {
      const what = TEST_OUTCOMES.filter((o) => g.outcomes.has(o)).map((o) => `${OUTCOME_LABELS[o]} in ${runList(g.outcomes.get(o)!)}`);
      const head = g.sf === null ? "no prediction (the layout could not be solved)" : `predicted safety factor ${formatSafetyFactor(g.sf)}`;
      return `${head} — ${what.join(", ")}`;
    });
}

/** The set-up in a line: "Kv 4000 rpm/V at 80 A · gearing 3.45 × 2.60 (8.98:1) · lock 28° · 1.6 kg car". */
export function setupText(s: TestSetup): string {
  const motor = s.motor.kind === "kv" ? `Kv ${s.motor.kvRpmPerV} rpm/V at ${s.motor.currentA} A` : `${s.motor.torqueNm} N·m motor`;
  const overall = s.gearRatios.reduce((a, b) => a * b, 1);
  const gearing = s.gearRatios.length > 1 ? `gearing ${s.gearRatios.map((r) => r.toFixed(2)).join(" × ")} (${overall.toFixed(2)}:1)` : `gearing ${overall.toFixed(2)}:1`;
  return [motor, gearing, s.lockDeg === null ? null : `lock ${s.lockDeg}°`, s.load || null].filter(Boolean).join(" · ");
}

/** Gear ratios typed as "3.45 × 2.6", "3.45 x 2.6" or "3.45, 2.6"; null when any part is not a number. */
export function parseGearRatios(text: string): number[] | null {
  const parts = text.split(/[×x*,;\s]+/i).filter(Boolean);
  if (parts.length === 0) return null;
  const ratios = parts.map(Number);
  return ratios.every((r) => Number.isFinite(r)) ? ratios : null;
}
