import { shelfItemCreateBody } from "@/contracts/shelf";
import { createShelfItem, listShelf } from "@/server/data/shelf";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

export const GET = workspaceRoute<Params, "shelf">("shelf", "read", async (_req, access) => {
  return Response.json({ items: await listShelf(access.workspace.id) });
});

export const POST = workspaceRoute<Params, "shelf">("shelf", "create", async (req, access) => {
  const item = await createShelfItem(access.workspace.id, access.user.id, await readJson(req, shelfItemCreateBody));
  return Response.json({ item }, { status: 201, headers: { location: `/api/workspaces/${access.workspace.id}/shelf/${item.id}` } });
});
