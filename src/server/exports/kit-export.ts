import "server-only";
// One kit export as an HTTP answer: the query read and checked, the kit read from its workspace (the guard
// has already checked the role), analysed, rendered, and sent as a download named after the kit.
import { exportQuerySchema, type ExportFile, type ExportQuery } from "@/contracts/exports";
import type { LengthUnit } from "@/figures/length-unit";
import { kitScenes } from "@/drawing/kit-scenes";
import type { WorkspaceAccess } from "../data/guard";
import { getKit, kitIdOrNotFound } from "../data/kits";
import { getPreferences } from "../data/preferences";
import { readQuery } from "../http/query";
import { analysedForExport, kitExportMeta, type ExportKit, type ExportMeta } from "./export-kit";
import { sheetPdf } from "./sheet-pdf";
import { envelopeCsv, travelCsv } from "./sweep-csv";
import { viewSvg } from "./view-svg";
import { viewsDxf } from "./views-dxf";

const TYPES: Record<string, string> = {
  pdf: "application/pdf",
  dxf: "application/dxf",
  csv: "text/csv; charset=utf-8",
  svg: "image/svg+xml; charset=utf-8",
};

/** A file name from the kit's name: lower-case letters, digits and dashes, then the revision and the part. */
export function exportFileName(meta: ExportMeta, file: ExportFile): string {
  const slug = meta.kitName.normalize("NFKD").toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "kit";
  return `${slug}-rev${meta.revision.replace(/[^A-Za-z0-9]+/g, "")}-${file}`;
}

function download(body: string | Buffer, meta: ExportMeta, file: ExportFile): Response {
  const ext = file.slice(file.lastIndexOf(".") + 1);
  const name = exportFileName(meta, file);
  const bytes = typeof body === "string" ? Buffer.from(body, "utf8") : body;
  return new Response(new Uint8Array(bytes), {
    headers: {
      "content-type": TYPES[ext]!,
      // The editor shows how much of the file has arrived.
      "content-length": String(bytes.byteLength),
      "content-disposition": `attachment; filename="${name}"`,
      "cache-control": "private, no-store",
      "x-content-type-options": "nosniff",
    },
  });
}

/** The export `file` of the kit `rawKitId` in the caller's workspace (404 for a kit of another workspace). */
export async function kitExportResponse(file: ExportFile, req: Request, access: WorkspaceAccess, rawKitId: string): Promise<Response> {
  const kitId = kitIdOrNotFound(rawKitId);
  // The query is checked before any work: a bad parameter costs nothing.
  const query = readQuery(req, exportQuerySchema(file));
  const [kit, prefs] = await Promise.all([getKit(access.workspace.id, kitId), query.unit ? null : getPreferences(access.user.id)]);
  const unit: LengthUnit = query.unit ?? prefs?.lengthUnit ?? "mm";
  return layoutExportResponse(file, query, unit, kit.layout, kitExportMeta(kit, access.workspace));
}

/** The export `file` of a stored layout with its title-block words (a kit's head, or a shared revision). */
export async function layoutExportResponse(file: ExportFile, query: ExportQuery, unit: LengthUnit, storedLayout: unknown, meta: ExportMeta): Promise<Response> {
  const grid = file === "envelope.csv" || file === "travel.csv" ? { travelSteps: query.travelSteps ?? 21, steerSteps: query.steerSteps ?? 41 } : undefined;
  const ready: ExportKit = await analysedForExport(storedLayout, meta, grid);
  switch (file) {
    case "sheet.pdf":
      return download(await sheetPdf([ready], { paper: query.paper ?? "a4", orientation: query.orientation ?? "portrait", unit }), meta, file);
    case "views.dxf":
      return download(viewsDxf(ready), meta, file);
    case "envelope.csv":
      return download(envelopeCsv(ready.layout, ready.analysis, unit), meta, file);
    case "travel.csv":
      return download(travelCsv(ready.analysis, unit), meta, file);
    case "front.svg":
    case "top.svg":
    case "joint.svg": {
      const scenes = kitScenes(ready.layout, ready.analysis, unit);
      return download(viewSvg(scenes[file.slice(0, -4) as "front" | "top" | "joint"], meta, unit), meta, file);
    }
  }
}
