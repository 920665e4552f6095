import { kitIdOrNotFound } from "@/server/data/kits";
import { addRunPhoto, runIdOrNotFound } from "@/server/data/test-runs";
import { workspaceUploadRoute } from "@/server/http/route";
import { readImageUpload } from "@/server/http/upload";

type Params = { workspaceId: string; kitId: string; runId: string };

/** The photo's bytes as the body (application/octet-stream), its name in X-File-Name. */
export const POST = workspaceUploadRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const kitId = kitIdOrNotFound(params.kitId);
  const runId = runIdOrNotFound(params.runId);
  const photo = await addRunPhoto(access.workspace.id, kitId, runId, access.user.id, () => readImageUpload(req, "test-photo"));
  return Response.json({ photo }, { status: 201 });
});
