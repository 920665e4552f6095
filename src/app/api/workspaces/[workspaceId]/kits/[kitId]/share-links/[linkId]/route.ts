import { kitIdOrNotFound } from "@/server/data/kits";
import { revokeShareLink } from "@/server/data/share-links";
import { notFound } from "@/server/http/errors";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string; linkId: string };

const LINK_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

// Revoking: from the next request on, the link answers 404. The row stays, marked revoked, in the list.
export const DELETE = workspaceRoute<Params, "kit">("kit", "update", async (_req, access, params) => {
  if (!LINK_ID.test(params.linkId)) throw notFound("Share link");
  return Response.json({ link: await revokeShareLink(access.workspace.id, kitIdOrNotFound(params.kitId), params.linkId.toLowerCase()) });
});
