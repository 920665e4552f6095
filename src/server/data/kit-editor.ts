import "server-only";
import { FULL_FIGURES_GRID } from "@/contracts/analyze";
import { parseLayout, type Layout } from "@/contracts/layout";
import type { KitDetail } from "@/contracts/kits";
import { roleCan } from "@/contracts/roles";
import type { AnalysisResult } from "@/engine";
import { runAnalysis } from "../analysis/pool";
import { getKit, kitIdOrNotFound } from "./kits";
import { readStoredLayout } from "./layouts";
import { getPreferences } from "./preferences";
import type { WorkspaceAccess } from "./guard";

/** What the editor page needs, all read on the server so the figures arrive with the page. */
export type KitEditorData =
  | {
      readonly ok: true;
      readonly kit: Omit<KitDetail, "layout">;
      readonly layout: Layout;
      readonly readOnly: boolean;
      readonly lengthUnit: "mm" | "in";
      readonly analysis: AnalysisResult | null;
    }
  | { readonly ok: false; readonly kit: Omit<KitDetail, "layout">; readonly message: string };


export async function loadKitEditor(access: WorkspaceAccess, rawKitId: string): Promise<KitEditorData> {
  const { layout: stored, ...kit } = await getKit(access.workspace.id, kitIdOrNotFound(rawKitId));
  const parsed = parseLayout(readStoredLayout(stored));
  if (!parsed.ok) return { ok: false, kit, message: `The stored layout cannot be read: ${parsed.issues[0]?.message ?? "unknown schema"}.` };
  const [prefs, analysis] = await Promise.all([getPreferences(access.user.id), serverFigures(parsed.layout)]);
  return { ok: true, kit, layout: parsed.layout, readOnly: !roleCan(access.role, "kit", "update"), lengthUnit: prefs.lengthUnit, analysis };
}

/** The analysis to render with the page; null when it cannot be made now (the browser then computes it). */
async function serverFigures(layout: Layout): Promise<AnalysisResult | null> {
  try {
    const outcome = await runAnalysis({ layout, grid: FULL_FIGURES_GRID });
    return outcome.ok ? (JSON.parse(outcome.json) as { analysis: AnalysisResult }).analysis : null;
  } catch {
    return null; // a busy pool must not cost the page: the editor's worker makes the figures instead
  }
}
