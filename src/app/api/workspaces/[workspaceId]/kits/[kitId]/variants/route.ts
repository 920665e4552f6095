import { variantCreateBody } from "@/contracts/kits";
import { kitIdOrNotFound } from "@/server/data/kits";
import { readStoredLayout } from "@/server/data/layouts";
import { createVariant } from "@/server/data/revisions";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

// A new kit from this kit's head, or from `revision`; it remembers the kit and revision it came from.
export const POST = workspaceRoute<Params, "kit">("kit", "create", async (req, access, params) => {
  const id = kitIdOrNotFound(params.kitId);
  const body = await readJson(req, variantCreateBody);
  const kit = await createVariant(access.workspace.id, id, access.user.id, body);
  return Response.json({ kit: { ...kit, layout: readStoredLayout(kit.layout) } }, { status: 201, headers: { location: `/api/workspaces/${access.workspace.id}/kits/${kit.id}` } });
});
