import { testRunCreateBody } from "@/contracts/test-log";
import { kitIdOrNotFound } from "@/server/data/kits";
import { createTestRun, listTestRuns } from "@/server/data/test-runs";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  return Response.json({ runs: await listTestRuns(access.workspace.id, kitIdOrNotFound(params.kitId)) });
});

export const POST = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const kitId = kitIdOrNotFound(params.kitId);
  const body = await readJson(req, testRunCreateBody);
  return Response.json({ run: await createTestRun(access.workspace.id, kitId, access.user.id, body) }, { status: 201 });
});
