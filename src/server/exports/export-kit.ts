import "server-only";
// What every export is made from: a layout, the words of its title block, and its analysis. Anything that
// has a layout and those words can be exported (a kit here; a compare set or a shared link later).
import { FULL_FIGURES_GRID, type AnalyzeGrid } from "@/contracts/analyze";
import { parseLayout, type Layout } from "@/contracts/layout";
import type { AnalysisResult } from "@/engine";
import { runAnalysis } from "../analysis/pool";
import { readStoredLayout } from "../data/layouts";
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

interface StoredKit {
  readonly name: string;
  readonly scale: string;
  readonly headRevision: number;
  readonly createdByName: string | null;
  readonly updatedByName: string | null;
  readonly updatedAt: string;
}

/** The revision a sheet names: the kit's head revision (the layout it shows). */
export function kitRevision(kit: { readonly headRevision: number }): string {
  return String(kit.headRevision);
}

export function kitExportMeta(kit: StoredKit, workspace: { readonly name: string }): ExportMeta {
  return {
    kitName: kit.name,
    workspaceName: workspace.name,
    revision: kitRevision(kit),
    author: kit.updatedByName ?? kit.createdByName ?? "—",
    date: kit.updatedAt,
    modelScale: kit.scale,
  };
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
