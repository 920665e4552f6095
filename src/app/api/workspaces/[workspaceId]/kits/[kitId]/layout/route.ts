import { z } from "zod";
import { layoutSaveFields } from "@/contracts/kits";
import { kitIdOrNotFound, saveKitLayout } from "@/server/data/kits";
import { incomingLayout, readStoredLayout, requireValidLayout } from "@/server/data/layouts";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

const layoutBody = z.object({ ...layoutSaveFields, layout: incomingLayout }).strict();

// Saving a layout makes the kit's next revision (with its note and cached summary); stale versions get 409.
export const PUT = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const id = kitIdOrNotFound(params.kitId);
  const { version, layout, note } = await readJson(req, layoutBody);
  const kit = await saveKitLayout(access.workspace.id, id, access.user.id, version, requireValidLayout(layout), { kind: "save", note });
  return Response.json({ kit: { ...kit, layout: readStoredLayout(kit.layout) } });
});
