import { kitIdOrNotFound } from "@/server/data/kits";
import { getRevision, revisionNumberOrNotFound } from "@/server/data/revisions";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string; revision: string };

export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  const revision = await getRevision(access.workspace.id, kitIdOrNotFound(params.kitId), revisionNumberOrNotFound(params.revision));
  return Response.json({ revision });
});
