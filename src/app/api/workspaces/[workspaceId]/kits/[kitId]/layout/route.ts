import { z } from "zod";
import { versionField } from "@/contracts/kits";
import { kitIdOrNotFound, updateKit } from "@/server/data/kits";
import { incomingLayout, readStoredLayout, requireValidLayout } from "@/server/data/layouts";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

const layoutBody = z.object({ version: versionField, layout: incomingLayout }).strict();

export const PUT = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const id = kitIdOrNotFound(params.kitId);
  const { version, layout } = await readJson(req, layoutBody);
  const kit = await updateKit(access.workspace.id, id, access.user.id, version, { layout: requireValidLayout(layout) });
  return Response.json({ kit: { ...kit, layout: readStoredLayout(kit.layout) } });
});
