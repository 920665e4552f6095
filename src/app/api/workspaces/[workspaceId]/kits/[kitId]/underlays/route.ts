import { kitIdOrNotFound } from "@/server/data/kits";
import { listUnderlays } from "@/server/data/underlays";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  return Response.json({ underlays: await listUnderlays(access.workspace.id, kitIdOrNotFound(params.kitId)) });
});
