import { fileIdOrNotFound } from "@/server/data/attachments";
import { kitIdOrNotFound } from "@/server/data/kits";
import { deleteRunPhoto, runIdOrNotFound } from "@/server/data/test-runs";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string; runId: string; fileId: string };

export const DELETE = workspaceRoute<Params, "kit">("kit", "update", async (_req, access, params) => {
  await deleteRunPhoto(access.workspace.id, kitIdOrNotFound(params.kitId), runIdOrNotFound(params.runId), fileIdOrNotFound(params.fileId));
  return new Response(null, { status: 204 });
});
