import { kitIdOrNotFound } from "@/server/data/kits";
import { workspaceRoute } from "@/server/http/route";
import { searchBoss } from "@/server/search/search-queue";
import { cancelSearch, searchIdOrNotFound } from "@/server/search/searches";

type Params = { workspaceId: string; kitId: string; searchId: string };

// Stops a running search; what it found so far stays readable.
export const POST = workspaceRoute<Params, "kit">("kit", "update", async (_req, access, params) => {
  const search = await cancelSearch(await searchBoss("app"), access.workspace.id, kitIdOrNotFound(params.kitId), searchIdOrNotFound(params.searchId));
  return Response.json({ search });
});
