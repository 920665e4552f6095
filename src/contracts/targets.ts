import { z } from "zod";

// What a design must reach, per workspace, each overridable per kit; and how a readout is judged against
// it. The editor, the library table and the comparison all judge with these functions.

export interface Targets {
  /** Least inner-wheel steer lock, worst over travel, degrees. */
  readonly minLockDeg: number;
  /** Largest drive-joint operating angle inside the lock, degrees. */
  readonly maxJointAngleDeg: number;
  /** Least safety factor of the shaft neck in torsion. */
  readonly minSafetyFactor: number;
  /** Ackermann at lock, turn-centre form, %: the range wanted. */
  readonly ackermannMinPct: number;
  readonly ackermannMaxPct: number;
  /** Least neck-to-mouth clearance at the proposed steering stop, mm (a slotted cup has none to judge). */
  readonly minNeckClearanceMm: number;
}

export const TARGET_KEYS = ["minLockDeg", "maxJointAngleDeg", "minSafetyFactor", "ackermannMinPct", "ackermannMaxPct", "minNeckClearanceMm"] as const;
export type TargetKey = (typeof TARGET_KEYS)[number];

/**
 * Where a new workspace starts: plain starting points for a 1:10 car (common practice, not from a published
 * source), to be replaced with the team's own.
 */
export const DEFAULT_TARGETS: Targets = {
  minLockDeg: 30,
  maxJointAngleDeg: 30,
  minSafetyFactor: 2,
  ackermannMinPct: 0,
  ackermannMaxPct: 100,
  minNeckClearanceMm: 0.2,
};

export const TARGET_LABELS: Record<TargetKey, { label: string; unit: string }> = {
  minLockDeg: { label: "Least steer lock", unit: "°" },
  maxJointAngleDeg: { label: "Largest joint angle", unit: "°" },
  minSafetyFactor: { label: "Least safety factor", unit: "" },
  ackermannMinPct: { label: "Ackermann from", unit: "%" },
  ackermannMaxPct: { label: "Ackermann up to", unit: "%" },
  minNeckClearanceMm: { label: "Least neck clearance", unit: "mm" },
};

function bounded(key: TargetKey, min: number, max: number) {
  const { label, unit } = TARGET_LABELS[key];
  const u = unit ? (unit === "°" || unit === "%" ? unit : ` ${unit}`) : "";
  return z
    .number({ error: `${label} must be a number` })
    .refine(Number.isFinite, { error: `${label} must be a number` })
    .min(min, { error: `${label} must be at least ${min}${u}` })
    .max(max, { error: `${label} must be at most ${max}${u}` });
}

const targetFields = {
  minLockDeg: bounded("minLockDeg", 0, 80),
  maxJointAngleDeg: bounded("maxJointAngleDeg", 1, 89),
  minSafetyFactor: bounded("minSafetyFactor", 0.1, 50),
  ackermannMinPct: bounded("ackermannMinPct", -200, 300),
  ackermannMaxPct: bounded("ackermannMaxPct", -200, 300),
  minNeckClearanceMm: bounded("minNeckClearanceMm", -5, 20),
};

const rangeMessage = "Ackermann from must not be above Ackermann up to";

/** A workspace's targets: every key. */
export const targetsSchema = z.strictObject(targetFields).refine((t) => t.ackermannMinPct <= t.ackermannMaxPct, { message: rangeMessage, path: ["ackermannMinPct"] });

/** A kit's overrides: any of the keys (absent = the workspace's). The range is checked with the workspace's in effectiveTargetsProblem. */
export const targetOverridesSchema = z.strictObject(targetFields).partial();
export type TargetOverrides = z.infer<typeof targetOverridesSchema>;

/** The targets a kit is judged against: the workspace's, with the kit's overrides on top. */
export function effectiveTargets(workspace: Targets, overrides: TargetOverrides | null | undefined): Targets {
  const out: Record<string, number> = { ...workspace };
  for (const k of TARGET_KEYS) {
    const v = overrides?.[k];
    if (typeof v === "number" && Number.isFinite(v)) out[k] = v;
  }
  return out as unknown as Targets;
}

/** A field issue when a kit's overrides make the Ackermann range upside down with the workspace's, else null. */
export function effectiveTargetsProblem(workspace: Targets, overrides: TargetOverrides): { path: string; message: string } | null {
  const t = effectiveTargets(workspace, overrides);
  if (t.ackermannMinPct <= t.ackermannMaxPct) return null;
  const path = overrides.ackermannMinPct !== undefined ? "targets.ackermannMinPct" : "targets.ackermannMaxPct";
  return { path, message: `${rangeMessage} (the range would be ${t.ackermannMinPct} to ${t.ackermannMaxPct} %)` };
}

// --- readouts and verdicts ------------------------------------------------------------------------

/** The key readouts a kit is judged on (from its head revision's cached summary). */
export const READOUT_KEYS = ["lockDeg", "maxJointAngleDeg", "ackermannPct", "safetyFactor", "neckClearanceMm"] as const;
export type ReadoutKey = (typeof READOUT_KEYS)[number];
export type Readouts = { readonly [K in ReadoutKey]: number | null };

export const READOUT_LABELS: Record<ReadoutKey, { label: string; unit: string; digits: number }> = {
  lockDeg: { label: "Steer lock", unit: "°", digits: 1 },
  maxJointAngleDeg: { label: "Largest joint angle", unit: "°", digits: 1 },
  ackermannPct: { label: "Ackermann", unit: "%", digits: 0 },
  safetyFactor: { label: "Safety factor", unit: "", digits: 2 },
  neckClearanceMm: { label: "Neck clearance", unit: "mm", digits: 2 },
};

/** meets / misses the target; none when there is no figure to judge (a slotted cup's clearance, Ackermann with too little steer). */
export type Verdict = "meets" | "misses" | "none";

export function judgeReadout(key: ReadoutKey, value: number | null, t: Targets): Verdict {
  if (value === null || !Number.isFinite(value)) return "none";
  switch (key) {
    case "lockDeg":
      return value >= t.minLockDeg ? "meets" : "misses";
    case "maxJointAngleDeg":
      return value <= t.maxJointAngleDeg ? "meets" : "misses";
    case "safetyFactor":
      return value >= t.minSafetyFactor ? "meets" : "misses";
    case "neckClearanceMm":
      return value >= t.minNeckClearanceMm ? "meets" : "misses";
    case "ackermannPct":
      return value >= t.ackermannMinPct && value <= t.ackermannMaxPct ? "meets" : "misses";
  }
}

export function judgeReadouts(r: Readouts, t: Targets): Record<ReadoutKey, Verdict> {
  return Object.fromEntries(READOUT_KEYS.map((k) => [k, judgeReadout(k, r[k], t)])) as Record<ReadoutKey, Verdict>;
}

/** The target of a readout in words ("≥ 30°", "0 – 100 %"), for hints and legends. */
export function targetText(key: ReadoutKey, t: Targets): string {
  switch (key) {
    case "lockDeg":
      return `≥ ${t.minLockDeg}°`;
    case "maxJointAngleDeg":
      return `≤ ${t.maxJointAngleDeg}°`;
    case "safetyFactor":
      return `≥ ${t.minSafetyFactor}`;
    case "neckClearanceMm":
      return `≥ ${t.minNeckClearanceMm} mm`;
    case "ackermannPct":
      return `${t.ackermannMinPct} – ${t.ackermannMaxPct} %`;
  }
}

// Below these a difference is not one (half the last digit the readouts show).
const SAME_WITHIN: Record<ReadoutKey, number> = { lockDeg: 0.05, maxJointAngleDeg: 0.05, ackermannPct: 0.5, safetyFactor: 0.005, neckClearanceMm: 0.005 };

/** How far a value is from its target, ≥ 0, 0 when it meets it; larger is worse. */
function shortfall(key: ReadoutKey, v: number, t: Targets): number {
  switch (key) {
    case "lockDeg":
      return Math.max(0, t.minLockDeg - v);
    case "maxJointAngleDeg":
      return Math.max(0, v - t.maxJointAngleDeg);
    case "safetyFactor":
      return Math.max(0, t.minSafetyFactor - v);
    case "neckClearanceMm":
      return Math.max(0, t.minNeckClearanceMm - v);
    case "ackermannPct":
      return v < t.ackermannMinPct ? t.ackermannMinPct - v : Math.max(0, v - t.ackermannMaxPct);
  }
}

// Which way is better once a target is met: more lock, less joint angle, more strength, more clearance.
// Ackermann has no better side inside its range.
const MORE_IS_BETTER: Record<ReadoutKey, boolean | null> = { lockDeg: true, maxJointAngleDeg: false, safetyFactor: true, neckClearanceMm: true, ackermannPct: null };

export type Change = "better" | "worse" | "same" | "changed";

export interface ReadoutChange {
  readonly change: Change;
  /** Set when the verdict flips between the two. */
  readonly crossed: "now-meets" | "now-misses" | null;
}

/**
 * How `value` compares with `base` for one readout, judged against the targets: closer to (or further past)
 * the target is better, further from it worse; a flip of the verdict is named. "changed" when it differs with
 * no better side (inside the Ackermann range, or a figure appearing or vanishing).
 */
export function compareReadout(key: ReadoutKey, base: number | null, value: number | null, targets: Targets, baseTargets: Targets = targets): ReadoutChange {
  const vb = judgeReadout(key, base, baseTargets);
  const vv = judgeReadout(key, value, targets);
  const crossed = vb === "meets" && vv === "misses" ? "now-misses" : vb === "misses" && vv === "meets" ? "now-meets" : null;
  if (base === null || value === null) return { change: base === value ? "same" : "changed", crossed };
  if (Math.abs(value - base) < SAME_WITHIN[key] && crossed === null) return { change: "same", crossed };
  const sb = shortfall(key, base, baseTargets);
  const sv = shortfall(key, value, targets);
  if (Math.abs(sv - sb) >= SAME_WITHIN[key] || crossed) return { change: sv < sb ? "better" : "worse", crossed };
  const more = MORE_IS_BETTER[key];
  if (more === null) return { change: "changed", crossed };
  return { change: (value > base) === more ? "better" : "worse", crossed };
}
