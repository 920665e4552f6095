import { workspaceCreateBody } from "@/contracts/workspaces";
import { resolveActiveWorkspace } from "@/server/data/guard";
import { createWorkspace, listWorkspacesOf } from "@/server/data/workspaces";
import { readJson } from "@/server/http/body";
import { sessionRoute } from "@/server/http/route";

export const GET = sessionRoute<object>(async (_req, signed) => {
  return Response.json({ workspaces: await listWorkspacesOf(signed.user.id), activeWorkspaceId: await resolveActiveWorkspace(signed) });
});

export const POST = sessionRoute<object>(async (req, signed) => {
  const { name } = await readJson(req, workspaceCreateBody);
  return Response.json({ workspace: await createWorkspace({ name, ownerId: signed.user.id }) }, { status: 201 });
});
