import { kitIdOrNotFound } from "@/server/data/kits";
import { listRevisions } from "@/server/data/revisions";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  return Response.json({ revisions: await listRevisions(access.workspace.id, kitIdOrNotFound(params.kitId)) });
});
