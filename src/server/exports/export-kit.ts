import "server-only";
// What every export is made from: a layout, the words of its title block, and its analysis. Anything that
// has a layout and those words can be exported: a kit's head or a pinned revision (loadExportKit), from
// the kit's own routes, a comparison's sheet or a share link.
import { FULL_FIGURES_GRID, type AnalyzeGrid } from "@/contracts/analyze";
import { parseLayout, type Layout } from "@/contracts/layout";
import type { AnalysisResult } from "@/engine";
import { runAnalysis } from "../analysis/pool";
import { getKit } from "../data/kits";
import { readStoredLayout } from "../data/layouts";
import { getRevision } from "../data/revisions";
import { HttpError } from "../http/errors";

/** The title block's words. */
export interface ExportMeta {
  readonly kitName: string;
  readonly workspaceName: string;
  /** What the title block calls the revision. */
  readonly revision: string;
  /** Who wrote this revision of the layout. */
  readonly author: string;
  /** When this revision was written (ISO date-time). */
  readonly date: string;
  /** The model's scale, "1:10". */
  readonly modelScale: string;
}

export interface ExportKit {
  readonly layout: Layout;
  readonly meta: ExportMeta;
  readonly analysis: AnalysisResult;
}

/**
 * A kit of this workspace at a revision, analysed and ready to export: `revision` null is the head. The
 * title block names that revision, who wrote it and when (a rename or a change of targets writes no
 * revision, so it changes neither). 404 for a kit not in the workspace or a revision it does not have.
 */
export async function loadExportKit(workspace: { readonly id: string; readonly name: string }, kitId: string, revision: number | null, grid?: AnalyzeGrid): Promise<ExportKit> {
  const kit = await getKit(workspace.id, kitId);
  const rev = await getRevision(workspace.id, kit.id, revision ?? kit.headRevision);
  const meta: ExportMeta = {
    kitName: kit.name,
    workspaceName: workspace.name,
    revision: String(rev.number),
    author: rev.authorName ?? "—",
    date: rev.createdAt,
    modelScale: kit.scale,
  };
  return analysedForExport(rev.layout, meta, grid);
}

/**
 * Reads the stored layout and analyses it (in the analysis workers) on the editor's grid, or a finer one
 * for an envelope file. A layout that cannot be read or analysed is a 422 naming what is wrong.
 */
export async function analysedForExport(storedLayout: unknown, meta: ExportMeta, grid: AnalyzeGrid = FULL_FIGURES_GRID): Promise<ExportKit> {
  const parsed = parseLayout(readStoredLayout(storedLayout));
  if (!parsed.ok) throw new HttpError(422, "unreadable_layout", `The kit's layout cannot be read: ${parsed.issues[0]?.message ?? "unknown schema"}.`);
  const outcome = await runAnalysis({ layout: parsed.layout, grid });
  if (!outcome.ok) throw new HttpError(outcome.status, outcome.code, outcome.message, outcome.fields, outcome.part ? { part: outcome.part, reason: outcome.reason } : undefined);
  const { analysis } = JSON.parse(outcome.json) as { analysis: AnalysisResult };
  return { layout: parsed.layout, meta, analysis };
}
