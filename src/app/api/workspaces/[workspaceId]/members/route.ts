import { invitationCreateBody } from "@/contracts/workspaces";
import { inviteToWorkspace } from "@/server/data/invitations";
import { listMembers } from "@/server/data/workspaces";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

export const GET = workspaceRoute<Params, "member">("member", "read", async (_req, access) => {
  return Response.json({ members: await listMembers(access.workspace.id), yourRole: access.role });
});

// Adding someone is an invitation they accept (POST /api/me/invitations/[id]/accept). 202 with the same body
// whether or not the address has an account or is already a member: the answer reveals neither.
export const POST = workspaceRoute<Params, "invitation">("invitation", "create", async (req, access) => {
  const { email, role } = await readJson(req, invitationCreateBody);
  const invitation = await inviteToWorkspace(access.workspace.id, { userId: access.user.id, role: access.role }, email, role);
  return Response.json({ invitation }, { status: 202 });
});
