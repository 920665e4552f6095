import "server-only";
import { FULL_FIGURES_GRID } from "@/contracts/analyze";
import { parseLayout, type Layout } from "@/contracts/layout";
import type { KitDetail } from "@/contracts/kits";
import { roleCan } from "@/contracts/roles";
import type { TargetOverrides, Targets } from "@/contracts/targets";
import type { AnalysisResult } from "@/engine";
import { runAnalysis } from "../analysis/pool";
import { getKit, kitIdOrNotFound } from "./kits";
import { readStoredLayout } from "./layouts";
import { getPreferences } from "./preferences";
import { getRevision } from "./revisions";
import { getTargets } from "./targets";
import type { WorkspaceAccess } from "./guard";

/** The kit's place in the design library, for the editor's history, targets and shelf tabs. */
export type KitLibraryData = {
  readonly workspaceTargets: Targets;
  readonly overrides: TargetOverrides;
  readonly canWrite: boolean;
  /** Set when the page shows an earlier revision, read-only. */
  readonly viewing: { readonly revision: number; readonly note: string; readonly authorName: string | null; readonly createdAt: string } | null;
};

/** What the editor page needs, all read on the server so the figures arrive with the page. */
export type KitEditorData =
  | {
      readonly ok: true;
      readonly kit: Omit<KitDetail, "layout">;
      readonly layout: Layout;
      readonly readOnly: boolean;
      readonly lengthUnit: "mm" | "in";
      readonly analysis: AnalysisResult | null;
      readonly library: KitLibraryData;
    }
  | { readonly ok: false; readonly kit: Omit<KitDetail, "layout">; readonly message: string };


/** The kit's head, or with `revision` one earlier revision (always read-only). */
export async function loadKitEditor(access: WorkspaceAccess, rawKitId: string, revision: number | null = null): Promise<KitEditorData> {
  const { layout: stored, ...kit } = await getKit(access.workspace.id, kitIdOrNotFound(rawKitId));
  const rev = revision !== null && revision !== kit.headRevision ? await getRevision(access.workspace.id, kit.id, revision) : null;
  const parsed = parseLayout(rev ? rev.layout : readStoredLayout(stored));
  if (!parsed.ok) return { ok: false, kit, message: `The stored layout cannot be read: ${parsed.issues[0]?.message ?? "unknown schema"}.` };
  const canWrite = roleCan(access.role, "kit", "update");
  const [prefs, analysis, targets] = await Promise.all([getPreferences(access.user.id), serverFigures(parsed.layout), getTargets(access.workspace.id)]);
  return {
    ok: true,
    kit,
    layout: parsed.layout,
    readOnly: !canWrite || rev !== null,
    lengthUnit: prefs.lengthUnit,
    analysis,
    library: {
      workspaceTargets: targets.targets,
      overrides: kit.targetOverrides,
      canWrite,
      viewing: rev ? { revision: rev.number, note: rev.note, authorName: rev.authorName, createdAt: rev.createdAt } : null,
    },
  };
}

/** The analysis to render with the page; null when it cannot be made now (the browser then computes it). */
export async function serverFigures(layout: Layout): Promise<AnalysisResult | null> {
  try {
    const outcome = await runAnalysis({ layout, grid: FULL_FIGURES_GRID });
    return outcome.ok ? (JSON.parse(outcome.json) as { analysis: AnalysisResult }).analysis : null;
  } catch {
    return null; // a busy pool must not cost the page: the editor's worker makes the figures instead
  }
}
