import { z } from "zod";
import { targetsSchema } from "@/contracts/targets";
import { versionField } from "@/contracts/kits";
import { getTargets, putTargets } from "@/server/data/targets";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

export const GET = workspaceRoute<Params, "target">("target", "read", async (_req, access) => {
  return Response.json(await getTargets(access.workspace.id));
});

const putBody = z.strictObject({ version: versionField, targets: targetsSchema });

export const PUT = workspaceRoute<Params, "target">("target", "update", async (req, access) => {
  const { version, targets } = await readJson(req, putBody);
  return Response.json(await putTargets(access.workspace.id, access.user.id, version, targets));
});
