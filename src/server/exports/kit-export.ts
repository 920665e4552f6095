import "server-only";
// One kit export as an HTTP answer: the query read and checked, the kit read from its workspace (the guard
// has already checked the role), analysed, rendered, and sent as a download named after the kit.
import { exportQuerySchema, type ExportFile, type ExportQuery } from "@/contracts/exports";
import type { LengthUnit } from "@/figures/length-unit";
import { kitScenes } from "@/drawing/kit-scenes";
import type { WorkspaceAccess } from "../data/guard";
import { kitIdOrNotFound } from "../data/kits";
import { getPreferences } from "../data/preferences";
import { readQuery } from "../http/query";
import { analysedForExport, loadExportKit, type ExportKit, type ExportMeta } from "./export-kit";
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

/** A kit's name as a file name: lower-case letters, digits and dashes, at most `max` long, cut between words. */
export function kitSlug(kitName: string, max = 60): string {
  const slug = kitName.normalize("NFKD").toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "");
  if (slug.length <= max) return slug || "kit";
  const cut = slug.slice(0, max + 1);
  // A word cut in two reads as another word; a single word longer than `max` is cut where it must be.
  return (cut.lastIndexOf("-") > 0 ? cut.slice(0, cut.lastIndexOf("-")) : slug.slice(0, max)).replace(/-+$/, "");
}

/** The revision as a file name's part: "rev2". */
export const revisionSlug = (meta: ExportMeta) => `rev${meta.revision.replace(/[^A-Za-z0-9]+/g, "")}`;

/** A file name from the kit's name, then the revision and the part. */
export function exportFileName(meta: ExportMeta, file: ExportFile): string {
  return `${kitSlug(meta.kitName)}-${revisionSlug(meta)}-${file}`;
}

/** An export as a download named `name` (its type from the name's extension), never cached. */
export function download(body: string | Buffer, name: string): Response {
  const ext = name.slice(name.lastIndexOf(".") + 1);
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

/** The unit asked for, else the person's preference. */
export async function exportUnit(query: { readonly unit?: LengthUnit }, access: WorkspaceAccess): Promise<LengthUnit> {
  return query.unit ?? (await getPreferences(access.user.id)).lengthUnit;
}

/**
 * The export `file` of the kit `rawKitId` in the caller's workspace, at its head or at `?revision=n` (404
 * for a kit of another workspace or a revision the kit does not have).
 */
export async function kitExportResponse(file: ExportFile, req: Request, access: WorkspaceAccess, rawKitId: string): Promise<Response> {
  const kitId = kitIdOrNotFound(rawKitId);
  // The query is checked before any work: a bad parameter costs nothing.
  const query = readQuery(req, exportQuerySchema(file));
  const grid = exportGrid(file, query);
  const [ready, unit]: [ExportKit, LengthUnit] = await Promise.all([loadExportKit(access.workspace, kitId, query.revision ?? null, grid), exportUnit(query, access)]);
  return exportFileResponse(file, query, unit, ready);
}

/** The envelope grid a sweep CSV asks for; other files use the full figures' grid. */
const exportGrid = (file: ExportFile, query: ExportQuery) =>
  file === "envelope.csv" || file === "travel.csv" ? { travelSteps: query.travelSteps ?? 21, steerSteps: query.steerSteps ?? 41 } : undefined;

/** The export `file` of a stored layout with its title-block words (a shared revision). */
export async function layoutExportResponse(file: ExportFile, query: ExportQuery, unit: LengthUnit, storedLayout: unknown, meta: ExportMeta): Promise<Response> {
  return exportFileResponse(file, query, unit, await analysedForExport(storedLayout, meta, exportGrid(file, query)));
}

async function exportFileResponse(file: ExportFile, query: ExportQuery, unit: LengthUnit, ready: ExportKit): Promise<Response> {
  const name = exportFileName(ready.meta, file);
  switch (file) {
    case "sheet.pdf":
      return download(await sheetPdf([ready], { paper: query.paper ?? "a4", orientation: query.orientation ?? "portrait", unit }), name);
    case "views.dxf":
      return download(viewsDxf(ready), name);
    case "envelope.csv":
      return download(envelopeCsv(ready.layout, ready.analysis, unit), name);
    case "travel.csv":
      return download(travelCsv(ready.analysis, unit), name);
    case "front.svg":
    case "top.svg":
    case "joint.svg": {
      const scenes = kitScenes(ready.layout, ready.analysis, unit);
      return download(viewSvg(scenes[file.slice(0, -4) as "front" | "top" | "joint"], ready.meta, unit), name);
    }
  }
}
