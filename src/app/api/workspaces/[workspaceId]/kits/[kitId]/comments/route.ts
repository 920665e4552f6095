import { commentCreateSchema } from "@/contracts/sharing";
import { roleCan } from "@/contracts/roles";
import { noticeCommentPosted } from "@/server/data/comment-notice";
import { createComment, listComments } from "@/server/data/comments";
import { getKit, kitIdOrNotFound } from "@/server/data/kits";
import { readJson } from "@/server/http/body";
import { enforceCommentRate } from "@/server/http/rate-limit";
import { workspaceRoute } from "@/server/http/route";

type Params = { workspaceId: string; kitId: string };

const readerOf = (access: { user: { id: string }; role: string }) => ({ userId: access.user.id, canModerate: roleCan(access.role, "kit", "update") });

// Every member may read and write comments (viewers too: reviewing is what they are there for).
export const GET = workspaceRoute<Params, "kit">("kit", "read", async (_req, access, params) => {
  return Response.json({ threads: await listComments(access.workspace.id, kitIdOrNotFound(params.kitId), readerOf(access)) });
});

export const POST = workspaceRoute<Params, "kit">("kit", "read", async (req, access, params) => {
  const kitId = kitIdOrNotFound(params.kitId);
  const body = await readJson(req, commentCreateSchema);
  await enforceCommentRate({ userId: access.user.id });
  const comment = await createComment(access.workspace.id, kitId, { kind: "member", userId: access.user.id, name: access.user.name }, body, readerOf(access));
  const kit = await getKit(access.workspace.id, kitId);
  await noticeCommentPosted(access.workspace.id, { id: kitId, name: kit.name }, access.user.id, comment);
  return Response.json({ comment }, { status: 201 });
});
