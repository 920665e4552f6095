import { searchQuestionSchema } from "@/contracts/design-search";
import { kitIdOrNotFound } from "@/server/data/kits";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";
import { searchBoss } from "@/server/search/search-queue";
import { listSearches, startSearch } from "@/server/search/searches";

type Params = { workspaceId: string; kitId: string };

// A kit's design searches: any member reads them; starting one is an edit of the kit.
export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  return Response.json({ searches: await listSearches(access.workspace.id, kitIdOrNotFound(params.kitId)) });
});

export const POST = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const kitId = kitIdOrNotFound(params.kitId);
  const question = await readJson(req, searchQuestionSchema);
  const search = await startSearch(await searchBoss("app"), access.workspace.id, kitId, access.user.id, question);
  return Response.json({ search }, { status: 202, headers: { location: `/api/workspaces/${access.workspace.id}/kits/${kitId}/searches/${search.id}` } });
});
