import { loadComparison } from "@/server/data/compare";
import { workspaceRoute } from "@/server/http/route";

// ?items=A,B@3: two to four kits (head) or revisions (@n) of this workspace, each with its layout and analysis.
export const GET = workspaceRoute<{ workspaceId: string }, "kit">("kit", "read", async (req, access) => {
  return Response.json(await loadComparison(access.workspace.id, new URL(req.url).searchParams.get("items")));
});
