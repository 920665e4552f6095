import { kitIdOrNotFound } from "@/server/data/kits";
import { workspaceRoute } from "@/server/http/route";
import { getSearch, searchIdOrNotFound } from "@/server/search/searches";

type Params = { workspaceId: string; kitId: string; searchId: string };

// One search: its question, progress and (once done) its answer.
export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  return Response.json({ search: await getSearch(access.workspace.id, kitIdOrNotFound(params.kitId), searchIdOrNotFound(params.searchId)) });
});
