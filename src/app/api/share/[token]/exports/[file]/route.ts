import { isExportFile, sharedExportQuerySchema } from "@/contracts/exports";
import { readSharedKit } from "@/server/data/shared-kit";
import { layoutExportResponse } from "@/server/exports/kit-export";
import { notFound } from "@/server/http/errors";
import { readQuery } from "@/server/http/query";
import { shareRoute } from "@/server/http/route";

type Params = { token: string; file: string };

// The shared revision's exports, as the editor's: lengths in the unit asked for (millimetres by default:
// a reviewer has no preferences), the DXF always 1:1 in mm.
export const GET = shareRoute<Params>(async (req, link, params) => {
  if (!isExportFile(params.file)) throw notFound("Export");
  const query = readQuery(req, sharedExportQuerySchema(params.file));
  const shared = await readSharedKit(link);
  return layoutExportResponse(params.file, query, query.unit ?? "mm", shared.layout, shared.meta);
});
