import { z } from "zod";
import type { AnalysisResult, SteerLimitReason } from "@/engine";
import { isStorableText, PG_INTEGER_MAX, storableTextMessage } from "./text";
import type { Readouts } from "./targets";

/**
 * The key readouts of one revision's layout, picked from the engine's analysis (default grid) when the
 * revision is saved and kept with it, so the library and the history show figures without re-solving.
 */
export interface RevisionSummary {
  /** steerLock.worst.innerDeg: inner-wheel lock, worst over travel. */
  readonly lockDeg: number;
  readonly lockOuterDeg: number;
  /** What binds first at the worst travel. */
  readonly lockLimitedBy: SteerLimitReason;
  readonly lockStaticDeg: number;
  /** drive.maxJointAngleWithinLockDeg. */
  readonly maxJointAngleDeg: number;
  readonly jointLimitDeg: number;
  /** ackermann.atLockPct (turn-centre form); null with too little steer to tell. */
  readonly ackermannPct: number | null;
  readonly safetyFactor: number;
  /** steeringStop.clearanceAtStopMm: the neck clearance at the proposed stop; null for a slotted cup. */
  readonly neckClearanceMm: number | null;
  readonly plungeMinMm: number;
  readonly plungeMaxMm: number;
  readonly camberStaticDeg: number;
  readonly kingpinInclinationDeg: number;
  readonly casterTrailMm: number;
  readonly scrubRadiusMm: number;
  readonly rollCentreHeightMm: number | null;
}

/**
 * The shape of analysis a summary was taken from (the engine's resultSchema). Migration recomputes any
 * stored summary older than this, so the library never judges figures whose meaning has since changed.
 */
export const SUMMARY_ANALYSIS_SCHEMA = 2;

/** As stored: the summary, or why the layout could not be analysed (it is kept all the same). */
export type StoredSummary = (({ readonly ok: true } & RevisionSummary) | { readonly ok: false; readonly reason: string }) & { readonly analysisSchema?: number };

/** A failed analysis as stored. */
export function failedSummary(reason: string): StoredSummary {
  return { ok: false, reason, analysisSchema: SUMMARY_ANALYSIS_SCHEMA };
}

export function summarizeAnalysis(a: AnalysisResult): RevisionSummary & { readonly analysisSchema: number } {
  return {
    analysisSchema: a.resultSchema,
    lockDeg: a.steerLock.worst.innerDeg,
    lockOuterDeg: a.steerLock.worst.outerDeg,
    lockLimitedBy: a.steerLock.worst.limitedBy,
    lockStaticDeg: a.steerLock.static.innerDeg,
    maxJointAngleDeg: a.drive.maxJointAngleWithinLockDeg,
    jointLimitDeg: a.drive.jointLimitDeg,
    ackermannPct: a.ackermann.atLockPct,
    safetyFactor: a.strength.safetyFactor,
    neckClearanceMm: a.steeringStop.clearanceAtStopMm,
    plungeMinMm: a.drive.plungeMinMm,
    plungeMaxMm: a.drive.plungeMaxMm,
    camberStaticDeg: a.atStatic.camberDeg,
    kingpinInclinationDeg: a.steerAxis.kingpinInclinationDeg,
    casterTrailMm: a.steerAxis.casterTrailMm,
    scrubRadiusMm: a.steerAxis.scrubRadiusMm,
    rollCentreHeightMm: a.atStatic.rollCentreHeightMm,
  };
}

const NO_READOUTS: Readouts = { lockDeg: null, maxJointAngleDeg: null, ackermannPct: null, safetyFactor: null, neckClearanceMm: null };

/** The judged readouts of a stored summary (all null when there is none or it failed). */
export function readoutsOf(s: StoredSummary | null | undefined): Readouts {
  if (!s || !s.ok) return NO_READOUTS;
  return { lockDeg: s.lockDeg, maxJointAngleDeg: s.maxJointAngleDeg, ackermannPct: s.ackermannPct, safetyFactor: s.safetyFactor, neckClearanceMm: s.neckClearanceMm };
}

export const REVISION_KIND_LABELS = {
  create: "created",
  save: "saved",
  restore: "restored",
  variant: "made as a variant",
  shelf: "shelf item changed",
  migrated: "kept from before revisions",
} as const;
export type RevisionKind = keyof typeof REVISION_KIND_LABELS;

/** A revision as the history lists it (dates as ISO strings). */
export interface RevisionRow {
  readonly number: number;
  readonly note: string;
  readonly kind: RevisionKind;
  readonly restoredFrom: number | null;
  readonly authorId: string | null;
  readonly authorName: string | null;
  readonly createdAt: string;
  readonly summary: StoredSummary | null;
}

export type RevisionDetail = RevisionRow & { readonly kitId: string; readonly layout: unknown };

export const revisionNote = z
  .string({ error: "Note must be text" })
  .trim()
  .max(500, "Note must be at most 500 characters")
  .refine((t) => isStorableText(t, true), storableTextMessage("Note", true));

/** A revision number in a path: 1 up to PostgreSQL's integer. Anything else is not there. */
export const revisionNumberParam = z.coerce.number().int().min(1).max(PG_INTEGER_MAX);
