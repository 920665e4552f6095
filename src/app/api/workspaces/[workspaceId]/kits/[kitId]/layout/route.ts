import { z } from "zod";
import { kitIdParam, versionField } from "@/contracts/kits";
import { updateKit } from "@/server/data/kits";
import { incomingLayout, readStoredLayout, requireValidLayout } from "@/server/data/layouts";
import { readJson } from "@/server/http/body";
import { notFound } from "@/server/http/errors";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

const layoutBody = z.object({ version: versionField, layout: incomingLayout }).strict();

export const PUT = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const id = kitIdParam.safeParse(params.kitId);
  if (!id.success) throw notFound("Kit");
  const { version, layout } = await readJson(req, layoutBody);
  const kit = await updateKit(access.workspace.id, id.data, version, { layout: requireValidLayout(layout) });
  return Response.json({ kit: { ...kit, layout: readStoredLayout(kit.layout) } });
});
