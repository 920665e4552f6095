import { calibrationApplyBody } from "@/contracts/calibration";
import { applyCalibration } from "@/server/data/calibration";
import { shelfItemIdOrNotFound } from "@/server/data/shelf";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; materialId: string };

/** Applies the material's calibration to its shelf item (a shelf edit: the kits it rewrites are confirmed). */
export const POST = workspaceRoute<Params, "shelf">("shelf", "update", async (req, access, params) => {
  const id = shelfItemIdOrNotFound(params.materialId);
  const body = await readJson(req, calibrationApplyBody);
  return Response.json(await applyCalibration(access.workspace.id, id, access.user.id, body));
});
