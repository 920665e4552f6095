import { revisionRestoreBody } from "@/contracts/kits";
import { kitIdOrNotFound } from "@/server/data/kits";
import { readStoredLayout } from "@/server/data/layouts";
import { restoreRevision, revisionNumberOrNotFound } from "@/server/data/revisions";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string; revision: string };

// Brings an earlier revision back as the new head: a new revision, nothing deleted; a stale version gets 409.
export const POST = workspaceRoute<Params, "kit">("kit", "update", async (req, access, params) => {
  const id = kitIdOrNotFound(params.kitId);
  const number = revisionNumberOrNotFound(params.revision);
  const { version, note } = await readJson(req, revisionRestoreBody);
  const kit = await restoreRevision(access.workspace.id, id, number, access.user.id, version, note);
  return Response.json({ kit: { ...kit, layout: readStoredLayout(kit.layout) } });
});
