// The messages between the editor and its analysis worker, and the worker's answer to one request. The
// answer is computed by the same engine and contract as the API (parse, upgrade, analyse), so the
// browser's figures are the server's.
import { FULL_FIGURES_GRID } from "@/contracts/analyze";
import { layoutFieldsSchema, layoutSchema, parseLayout } from "@/contracts/layout";
import { analyzeLayout, GeometryError, neckTradeoff, type AnalysisResult, type NeckTradeoff } from "@/engine";
import type { LayoutFault } from "../store/editor-store";
import { faultFromGeometry, faultFromIssues } from "./layout-faults";

export type AnalysisQuality = "coarse" | "full";

/** Grids: coarse keeps up with the pointer while dragging; full (the API's default) runs on release. */
export const ANALYSIS_GRIDS: Record<AnalysisQuality, { travelSteps: number; steerSteps: number }> = {
  coarse: { travelSteps: 9, steerSteps: 15 },
  full: FULL_FIGURES_GRID,
};

export interface AnalysisRequest {
  readonly type: "analyze";
  readonly id: number;
  readonly quality: AnalysisQuality;
  readonly layout: unknown;
}

export type AnalysisReply =
  | {
      readonly type: "result";
      readonly id: number;
      readonly quality: AnalysisQuality;
      readonly ok: true;
      readonly analysis: AnalysisResult;
      /** The neck trade-off, computed after a full analysis only (null on coarse, to keep up with the pointer). */
      readonly tradeoff: NeckTradeoff | null;
      readonly ms: number;
    }
  | { readonly type: "result"; readonly id: number; readonly quality: AnalysisQuality; readonly ok: false; readonly fault: LayoutFault; readonly ms: number };

const issuesOf = (error: { issues: readonly { path: readonly PropertyKey[]; message: string }[] }) =>
  error.issues.map((i) => ({ path: i.path.map(String).join("."), message: i.message }));

/** Validates and analyses one layout: a reply with the figures, or with the fault naming the part. */
export function answerAnalysisRequest(req: AnalysisRequest): AnalysisReply {
  const started = performance.now();
  const base = { type: "result" as const, id: req.id, quality: req.quality };
  const done = <T extends object>(r: T) => ({ ...base, ...r, ms: performance.now() - started });
  const parsed = parseLayout(req.layout);
  if (!parsed.ok) {
    // A value out of its range is "invalid"; values in range that do not fit together are "impossible".
    const fields = layoutFieldsSchema.safeParse(req.layout);
    if (!fields.success) return done({ ok: false as const, fault: faultFromIssues(issuesOf(fields.error), "invalid") });
    const cross = layoutSchema.safeParse(req.layout);
    return done({ ok: false as const, fault: faultFromIssues(cross.success ? parsed.issues : issuesOf(cross.error), "impossible") });
  }
  try {
    const analysis = analyzeLayout(parsed.layout, ANALYSIS_GRIDS[req.quality]);
    const tradeoff = req.quality === "full" ? neckTradeoff(parsed.layout) : null;
    return done({ ok: true as const, analysis, tradeoff });
  } catch (error) {
    if (error instanceof GeometryError) return done({ ok: false as const, fault: faultFromGeometry(error.part, error.reason) });
    throw error;
  }
}
