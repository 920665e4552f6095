import { testRunPatchBody } from "@/contracts/test-log";
import { kitIdOrNotFound } from "@/server/data/kits";
import { deleteTestRun, runIdOrNotFound, updateTestRun } from "@/server/data/test-runs";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string; runId: string };

export const PATCH = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const kitId = kitIdOrNotFound(params.kitId);
  const runId = runIdOrNotFound(params.runId);
  const patch = await readJson(req, testRunPatchBody);
  return Response.json({ run: await updateTestRun(access.workspace.id, kitId, runId, access.user.id, patch) });
});

export const DELETE = workspaceRoute<Params, "kit">("kit", "update", async (_req, access, params) => {
  await deleteTestRun(access.workspace.id, kitIdOrNotFound(params.kitId), runIdOrNotFound(params.runId));
  return new Response(null, { status: 204 });
});
