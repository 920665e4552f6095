import { memberRoleBody } from "@/contracts/workspaces";
import { changeMemberRole, listMembers, removeMember } from "@/server/data/workspaces";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; memberId: string };

export const PATCH = workspaceRoute<Params, "member">("member", "update", async (req, access, { memberId }) => {
  const { role } = await readJson(req, memberRoleBody);
  await changeMemberRole(access.workspace.id, access.user.id, memberId, role);
  return Response.json({ members: await listMembers(access.workspace.id) });
});

export const DELETE = workspaceRoute<Params, "member">("member", "delete", async (_req, access, { memberId }) => {
  await removeMember(access.workspace.id, access.user.id, memberId);
  return new Response(null, { status: 204 });
});
