import { listWorkspaceInvitations } from "@/server/data/invitations";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

// Who may invite may see who is invited.
export const GET = workspaceRoute<Params, "invitation">("invitation", "create", async (_req, access) => {
  return Response.json({ invitations: await listWorkspaceInvitations(access.workspace.id) });
});
