import { isExportFile } from "@/contracts/exports";
import { kitExportResponse } from "@/server/exports/kit-export";
import { notFound } from "@/server/http/errors";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string; file: string };

// The kit's exports (sheet.pdf, views.dxf, envelope.csv, travel.csv, front.svg, top.svg, joint.svg):
// whoever may read the kit may export it.
export const GET = workspaceRoute<Params, "kit">("kit", "read", async (req, access, params) => {
  if (!isExportFile(params.file)) throw notFound("Export");
  return kitExportResponse(params.file, req, access, params.kitId);
});
