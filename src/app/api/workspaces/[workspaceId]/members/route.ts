import { memberAddBody } from "@/contracts/workspaces";
import { addMemberByEmail, listMembers } from "@/server/data/workspaces";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string };

export const GET = workspaceRoute<Params, "member">("member", "read", async (_req, access) => {
  return Response.json({ members: await listMembers(access.workspace.id), yourRole: access.role });
});

export const POST = workspaceRoute<Params, "member">("member", "create", async (req, access) => {
  const { email, role } = await readJson(req, memberAddBody);
  const member = await addMemberByEmail(access.workspace.id, access.role, email, role);
  return Response.json({ member }, { status: 201 });
});
