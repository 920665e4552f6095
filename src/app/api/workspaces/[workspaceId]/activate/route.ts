import { chooseActiveWorkspace } from "@/server/data/guard";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

// Any member may make a workspace the one their session opens by default.
export const POST = workspaceRoute<Params, "kit">("kit", "read", async (req, access) => {
  await chooseActiveWorkspace(req.headers, access, access.workspace.id);
  return Response.json({ activeWorkspaceId: access.workspace.id });
});
