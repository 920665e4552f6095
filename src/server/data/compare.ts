import "server-only";
import { parseCompareItems, type ComparedItem, type Comparison } from "@/contracts/compare";
import { parseLayout } from "@/contracts/layout";
import { effectiveTargets } from "@/contracts/targets";
import type { AnalysisResult } from "@/engine";
import { runAnalysis } from "../analysis/pool";
import { HttpError } from "../http/errors";
import { getKit, kitIdOrNotFound } from "./kits";
import { readStoredLayout } from "./layouts";
import { getRevision } from "./revisions";
import { getTargets } from "./targets";

// The editor's grid, so compared figures are the ones each kit's page shows.
const FULL_GRID = { travelSteps: 21, steerSteps: 41 };

/** The items of `?items=` as kits and revisions of this workspace, each with its layout and full analysis. */
export async function loadComparison(workspaceId: string, rawItems: string | null): Promise<Comparison> {
  const parsed = parseCompareItems(rawItems ?? "");
  if (!parsed.ok) throw new HttpError(422, "invalid", `Invalid query: items: ${parsed.message}`, [{ path: "items", message: parsed.message }]);
  const { targets: workspace } = await getTargets(workspaceId);
  const items: ComparedItem[] = [];
  for (const ref of parsed.items) {
    const kit = await getKit(workspaceId, kitIdOrNotFound(ref.kitId));
    const revision = ref.revision ?? kit.headRevision;
    const stored = ref.revision === null ? readStoredLayout(kit.layout) : (await getRevision(workspaceId, kit.id, ref.revision)).layout;
    const layout = parseLayout(stored);
    let analysis: AnalysisResult | null = null;
    let problem: string | null = layout.ok ? null : `The stored layout cannot be read: ${layout.issues[0]?.message ?? "unknown schema"}`;
    if (layout.ok) {
      const outcome = await runAnalysis({ layout: layout.layout, grid: FULL_GRID });
      if (outcome.ok) analysis = (JSON.parse(outcome.json) as { analysis: AnalysisResult }).analysis;
      else problem = outcome.message;
    }
    items.push({
      kitId: kit.id,
      kitName: kit.name,
      scale: kit.scale,
      revision,
      isHead: revision === kit.headRevision,
      headRevision: kit.headRevision,
      layout: layout.ok ? layout.layout : null,
      analysis,
      problem,
      targets: effectiveTargets(workspace, kit.targetOverrides),
    });
  }
  return { items, workspaceTargets: workspace };
}
