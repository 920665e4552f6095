import { shelfItemPatchBody } from "@/contracts/shelf";
import { deleteShelfItem, getShelfItem, shelfItemIdOrNotFound, updateShelfItem } from "@/server/data/shelf";
import { roleCan } from "@/contracts/roles";
import { readJson } from "@/server/http/body";
import { forbidden } from "@/server/http/errors";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; itemId: string };

export const GET = workspaceRoute<Params, "shelf">("shelf", "read", async (_req, access, params) => {
  return Response.json({ item: await getShelfItem(access.workspace.id, shelfItemIdOrNotFound(params.itemId)) });
});

// Changing an item rewrites the kits that use it (a revision each), so it needs the right to change kits too;
// until the caller confirms exactly those kits, the answer is 409 `confirm_kits` listing them.
export const PATCH = workspaceRoute<Params, "shelf">("shelf", "update", async (req, access, params) => {
  if (!roleCan(access.role, "kit", "update")) throw forbidden(`${/^[aeiou]/i.test(access.role) ? "An" : "A"} ${access.role} of this workspace may not change kits.`);
  const id = shelfItemIdOrNotFound(params.itemId);
  const body = await readJson(req, shelfItemPatchBody);
  return Response.json(await updateShelfItem(access.workspace.id, id, access.user.id, body));
});

export const DELETE = workspaceRoute<Params, "shelf">("shelf", "delete", async (_req, access, params) => {
  await deleteShelfItem(access.workspace.id, shelfItemIdOrNotFound(params.itemId));
  return new Response(null, { status: 204 });
});
