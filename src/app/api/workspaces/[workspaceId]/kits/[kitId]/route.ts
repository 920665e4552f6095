import { kitIdParam, kitPatchBody } from "@/contracts/kits";
import { deleteKit, getKit, updateKit } from "@/server/data/kits";
import { readStoredLayout } from "@/server/data/layouts";
import { readJson } from "@/server/http/body";
import { notFound } from "@/server/http/errors";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

// A malformed id is simply a kit that is not there.
function kitId(params: Params): string {
  const parsed = kitIdParam.safeParse(params.kitId);
  if (!parsed.success) throw notFound("Kit");
  return parsed.data;
}

export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  const kit = await getKit(access.workspace.id, kitId(params));
  return Response.json({ kit: { ...kit, layout: readStoredLayout(kit.layout) } });
});

export const PATCH = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const id = kitId(params);
  const { version, ...patch } = await readJson(req, kitPatchBody);
  const kit = await updateKit(access.workspace.id, id, version, patch);
  return Response.json({ kit: { ...kit, layout: readStoredLayout(kit.layout) } });
});

export const DELETE = workspaceRoute<Params, "kit">("kit", "delete", async (_req, access, params) => {
  await deleteKit(access.workspace.id, kitId(params));
  return new Response(null, { status: 204 });
});
