import { kitPatchBody } from "@/contracts/kits";
import { deleteKitWithFiles } from "@/server/data/attachments";
import { getKit, kitIdOrNotFound, updateKit } from "@/server/data/kits";
import { readStoredLayout } from "@/server/data/layouts";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  const kit = await getKit(access.workspace.id, kitIdOrNotFound(params.kitId));
  return Response.json({ kit: { ...kit, layout: readStoredLayout(kit.layout) } });
});

export const PATCH = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const id = kitIdOrNotFound(params.kitId);
  const { version, ...patch } = await readJson(req, kitPatchBody);
  const kit = await updateKit(access.workspace.id, id, access.user.id, version, patch);
  return Response.json({ kit: { ...kit, layout: readStoredLayout(kit.layout) } });
});

export const DELETE = workspaceRoute<Params, "kit">("kit", "delete", async (_req, access, params) => {
  // Its test runs, photos and underlays go with it, their files too.
  await deleteKitWithFiles(access.workspace.id, kitIdOrNotFound(params.kitId));
  return new Response(null, { status: 204 });
});
