// One analysis request as plain data in and out, so it can run in a worker thread or inline.
import type { AnalyzeGrid } from "@/contracts/analyze";
import { impossibleGeometry, layoutFieldIssues, parseLayout } from "@/contracts/layout";
import { analyzeLayout, GeometryError } from "@/engine";

export type AnalysisJob = { readonly layout: unknown; readonly grid?: AnalyzeGrid; readonly envelope?: Record<string, unknown> };

export type AnalysisOutcome =
  | { readonly ok: true; readonly json: string }
  | { readonly ok: false; readonly status: 422; readonly code: string; readonly message: string; readonly fields?: { path: string; message: string }[]; readonly part?: string; readonly reason?: string };

/** Validates (and upgrades) the layout, analyses it and serialises `{ ...envelope, analysis }` to JSON. */
export function runAnalysisJob(job: AnalysisJob): AnalysisOutcome {
  const parsed = parseLayout(job.layout);
  if (!parsed.ok) {
    const fields = layoutFieldIssues(parsed.issues);
    const misfit = impossibleGeometry(parsed.issues);
    if (misfit) return { ok: false, status: 422, code: "impossible_geometry", message: `${misfit.part}: ${misfit.reason}`, fields, ...misfit };
    return { ok: false, status: 422, code: "invalid", message: `Invalid layout: ${fields[0]!.path}: ${fields[0]!.message}`, fields };
  }
  try {
    const analysis = analyzeLayout(parsed.layout, { travelSteps: job.grid?.travelSteps, steerSteps: job.grid?.steerSteps });
    return { ok: true, json: JSON.stringify({ ...job.envelope, analysis }) };
  } catch (error) {
    if (error instanceof GeometryError) return { ok: false, status: 422, code: "impossible_geometry", message: error.message, part: error.part, reason: error.reason };
    throw error;
  }
}
