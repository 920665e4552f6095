import { commentUpdateSchema } from "@/contracts/sharing";
import { roleCan } from "@/contracts/roles";
import { deleteComment, setThreadResolved } from "@/server/data/comments";
import { kitIdOrNotFound } from "@/server/data/kits";
import { readJson } from "@/server/http/body";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string; commentId: string };

const readerOf = (access: { user: { id: string }; role: string }) => ({ userId: access.user.id, canModerate: roleCan(access.role, "kit", "update") });

// Resolve or reopen a thread: any member. Delete: the comment's author, or an editor of the workspace.
export const PATCH = workspaceRoute<Params, "kit">("kit", "read", async (req, access, params) => {
  const kitId = kitIdOrNotFound(params.kitId);
  const { resolved } = await readJson(req, commentUpdateSchema);
  return Response.json({ comment: await setThreadResolved(access.workspace.id, kitId, params.commentId, resolved, access.user.name, readerOf(access)) });
});

export const DELETE = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  await deleteComment(access.workspace.id, kitIdOrNotFound(params.kitId), params.commentId, readerOf(access));
  return new Response(null, { status: 204 });
});
