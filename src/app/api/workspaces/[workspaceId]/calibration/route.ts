import { workspaceCalibration } from "@/server/data/calibration";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access) => {
  return Response.json({ materials: await workspaceCalibration(access.workspace.id) });
});
