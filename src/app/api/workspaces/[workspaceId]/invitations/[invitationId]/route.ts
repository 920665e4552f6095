import { revokeInvitation } from "@/server/data/invitations";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; invitationId: string };

export const DELETE = workspaceRoute<Params, "invitation">("invitation", "cancel", async (_req, access, { invitationId }) => {
  await revokeInvitation(access.workspace.id, access.role, invitationId);
  return new Response(null, { status: 204 });
});
