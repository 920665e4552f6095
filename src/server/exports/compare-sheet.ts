import "server-only";
// The comparison's dimension sheet as one PDF: each item of `?items=` (a kit's head, or `@n` a revision
// of it) gets its own page set — drawing page with its title block, then the tables — one after another.
import { compareSheetQuery } from "@/contracts/exports";
import type { WorkspaceAccess } from "../data/guard";
import { readQuery } from "../http/query";
import { loadExportKit, type ExportKit } from "./export-kit";
import { download, exportUnit, kitSlug, revisionSlug } from "./kit-export";
import { sheetPdf } from "./sheet-pdf";

/** "compare-{kit}-rev{n}-{kit}-rev{m}-sheet.pdf": every item named, each kit's part kept short. */
export function compareSheetName(kits: readonly ExportKit[]): string {
  return `compare-${kits.map((k) => `${kitSlug(k.meta.kitName, 40)}-${revisionSlug(k.meta)}`).join("-")}-sheet.pdf`;
}

/** The combined sheet of the items in the caller's workspace (404 for a kit of another one, or a revision not there). */
export async function compareSheetResponse(req: Request, access: WorkspaceAccess): Promise<Response> {
  // The items and choices are checked before any work: a bad parameter costs nothing.
  const query = readQuery(req, compareSheetQuery);
  const [kits, unit] = await Promise.all([
    Promise.all(query.items.map((ref) => loadExportKit(access.workspace, ref.kitId, ref.revision))),
    exportUnit(query, access),
  ]);
  const pdf = await sheetPdf(kits, { paper: query.paper ?? "a4", orientation: query.orientation ?? "portrait", unit });
  return download(pdf, compareSheetName(kits));
}
