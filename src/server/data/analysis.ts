import "server-only";
import type { AnalyzeGrid } from "@/contracts/analyze";
import { analyzeLayout, type AnalysisResult } from "@/engine";
import { requireValidLayout } from "./layouts";

/** Validates (and upgrades) a layout and runs the engine on it. Impossible geometry surfaces as a 422. */
export function analyzeDocument(doc: unknown, grid: AnalyzeGrid = {}): AnalysisResult {
  const layout = requireValidLayout(doc);
  return analyzeLayout(layout, { travelSteps: grid.travelSteps, steerSteps: grid.steerSteps });
}
