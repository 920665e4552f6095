import { kitsUsingShelfItem, shelfItemIdOrNotFound } from "@/server/data/shelf";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; itemId: string };

// The kits whose head layout takes figures from this item.
export const GET = workspaceRoute<Params, "shelf">("shelf", "read", async (_req, access, params) => {
  return Response.json({ kits: await kitsUsingShelfItem(access.workspace.id, shelfItemIdOrNotFound(params.itemId)) });
});
