import { underlayPatchBody } from "@/contracts/underlays";
import { kitIdOrNotFound } from "@/server/data/kits";
import { deleteUnderlay, patchUnderlay, placementFromHeader, putUnderlay, underlayViewOrNotFound } from "@/server/data/underlays";
import { readJson } from "@/server/http/body";
import { workspaceRoute, workspaceUploadRoute } from "@/server/http/route";
import { readImageUpload } from "@/server/http/upload";

type Params = { workspaceId: string; kitId: string; view: string };

/** The picture's bytes as the body (application/octet-stream); its first placement in X-Underlay-Placement. */
export const PUT = workspaceUploadRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const kitId = kitIdOrNotFound(params.kitId);
  const view = underlayViewOrNotFound(params.view);
  const placement = placementFromHeader(req.headers.get("x-underlay-placement"));
  const underlay = await putUnderlay(access.workspace.id, kitId, view, access.user.id, placement, () => readImageUpload(req, `underlay-${view}`));
  return Response.json({ underlay }, { status: 201 });
});

export const PATCH = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const kitId = kitIdOrNotFound(params.kitId);
  const view = underlayViewOrNotFound(params.view);
  const patch = await readJson(req, underlayPatchBody);
  return Response.json({ underlay: await patchUnderlay(access.workspace.id, kitId, view, access.user.id, patch) });
});

export const DELETE = workspaceRoute<Params, "kit">("kit", "update", async (_req, access, params) => {
  await deleteUnderlay(access.workspace.id, kitIdOrNotFound(params.kitId), underlayViewOrNotFound(params.view));
  return new Response(null, { status: 204 });
});
