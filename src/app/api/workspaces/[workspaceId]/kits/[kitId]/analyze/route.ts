import { kitAnalyzeBody } from "@/contracts/analyze";
import { analysisResponse } from "@/server/analysis/pool";
import { getKit, kitIdOrNotFound } from "@/server/data/kits";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

// Analyses the kit's stored layout: whoever may read the kit may analyse it.
export const POST = workspaceRoute<Params, "kit">("kit", "read", async (req, access, params) => {
  const id = kitIdOrNotFound(params.kitId);
  const hasBody = req.headers.get("content-length") !== "0" && req.body !== null;
  const { grid } = hasBody ? await readJson(req, kitAnalyzeBody) : { grid: undefined };
  const kit = await getKit(access.workspace.id, id);
  return analysisResponse({ layout: kit.layout, grid, envelope: { kitId: kit.id, version: kit.version } });
});
