import { setActiveWorkspace } from "@/server/data/workspaces";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

// Any member may make a workspace the one their session opens by default.
export const POST = workspaceRoute<Params, "kit">("kit", "read", async (_req, access) => {
  await setActiveWorkspace(access.sessionId, access.workspace.id);
  return Response.json({ activeWorkspaceId: access.workspace.id });
});
