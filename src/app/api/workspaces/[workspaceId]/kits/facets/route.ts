import { libraryFacets } from "@/server/data/kits";
import { workspaceRoute } from "@/server/http/route";

// The tags and authors the library can filter on, with how many kits each has.
export const GET = workspaceRoute<{ workspaceId: string }, "kit">("kit", "read", async (_req, access) => {
  return Response.json(await libraryFacets(access.workspace.id));
});
