import { invitationCreateBody } from "@/contracts/workspaces";
import { inviteToWorkspace } from "@/server/data/invitations";
import { listMembers } from "@/server/data/workspaces";
import { readJson } from "@/server/http/body";
import { enforceRate, INVITATION_RATE } from "@/server/http/rate-limit";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

export const GET = workspaceRoute<Params, "member">("member", "read", async (_req, access) => {
  return Response.json({ members: await listMembers(access.workspace.id), yourRole: access.role });
});

// Adding someone is an invitation they accept (POST /api/me/invitations/[id]/accept). 202 with the same body
// whether or not the address has an account or is already a member: the answer reveals neither. The
// message with the link goes through the outbox (sent now, retried if the SMTP server is down).
export const POST = workspaceRoute<Params, "invitation">("invitation", "create", async (req, access) => {
  const { email, role } = await readJson(req, invitationCreateBody);
  await enforceRate(INVITATION_RATE, `user:${access.user.id}`);
  const invitation = await inviteToWorkspace(access.workspace.id, { userId: access.user.id, role: access.role }, email, role);
  return Response.json({ invitation }, { status: 202 });
});
