import "server-only";
import { failedSummary, summarizeAnalysis, type StoredSummary } from "@/contracts/revisions";
import type { AnalysisResult } from "@/engine";
import { runAnalysisJob, type AnalysisOutcome } from "../analysis/analysis-job";
import { AnalysisBusyError, runAnalysis } from "../analysis/pool";

/**
 * The cached summary of a layout: the engine's analysis on the default grid, the key readouts picked from it.
 * A layout the engine cannot solve still saves; its summary says why.
 */
export async function summarizeLayout(layout: unknown): Promise<StoredSummary> {
  let outcome: AnalysisOutcome;
  try {
    outcome = await runAnalysis({ layout });
  } catch (error) {
    // A full queue must not refuse a save: one analysis on this thread costs a few milliseconds.
    if (!(error instanceof AnalysisBusyError)) throw error;
    outcome = runAnalysisJob({ layout });
  }
  if (!outcome.ok) return failedSummary(outcome.message);
  const { analysis } = JSON.parse(outcome.json) as { analysis: AnalysisResult };
  return { ok: true, ...summarizeAnalysis(analysis) };
}

/** The kit columns the library sorts and filters on, from the head revision's summary. */
export function readoutColumns(s: StoredSummary) {
  if (!s.ok) return { lockDeg: null, lockLimitedBy: null, maxJointAngleDeg: null, ackermannPct: null, safetyFactor: null, neckClearanceMm: null };
  return {
    lockDeg: s.lockDeg,
    lockLimitedBy: s.lockLimitedBy,
    maxJointAngleDeg: s.maxJointAngleDeg,
    ackermannPct: s.ackermannPct,
    safetyFactor: s.safetyFactor,
    neckClearanceMm: s.neckClearanceMm,
  };
}
