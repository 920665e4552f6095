import { shareLinkCreateSchema } from "@/contracts/sharing";
import { kitIdOrNotFound } from "@/server/data/kits";
import { createShareLink, listShareLinks } from "@/server/data/share-links";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

// Share links are the editors' to make, list and revoke: a viewer may read the kit but not hand it out.
export const GET = workspaceRoute<Params, "kit">("kit", "update", async (_req, access, params) => {
  return Response.json({ links: await listShareLinks(access.workspace.id, kitIdOrNotFound(params.kitId)) });
});

export const POST = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const kitId = kitIdOrNotFound(params.kitId);
  const body = await readJson(req, shareLinkCreateSchema);
  return Response.json(await createShareLink(access.workspace.id, kitId, access.user.id, body), { status: 201 });
});
