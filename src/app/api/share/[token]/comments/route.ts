import { sharedCommentCreateSchema } from "@/contracts/sharing";
import { clientAddress } from "@/server/http/client-address";
import { noticeCommentPosted } from "@/server/data/comment-notice";
import { createComment, listComments } from "@/server/data/comments";
import { readSharedKit } from "@/server/data/shared-kit";
import type { OpenShareLink } from "@/server/data/share-links";
import { readJson } from "@/server/http/body";
import { enforceCommentRate } from "@/server/http/rate-limit";
import { HttpError } from "@/server/http/errors";
import { shareRoute } from "@/server/http/route";

type Params = { token: string };

const READER = { userId: null, canModerate: false } as const;

// A link made without comments neither shows the workspace's discussion nor takes a comment: 403, since
// the link itself is valid (the page says so); a link that is not valid is 404 before this runs.
function requireComments(link: OpenShareLink): void {
  if (!link.allowComments) throw new HttpError(403, "comments_not_allowed", "This share link does not allow comments.");
}

export const GET = shareRoute<Params>(async (_req, link) => {
  requireComments(link);
  const shared = await readSharedKit(link);
  return Response.json({ threads: await listComments(link.workspaceId, link.kitId, READER, shared.revision) });
});

export const POST = shareRoute<Params>(async (req, link) => {
  requireComments(link);
  const body = await readJson(req, sharedCommentCreateSchema);
  await enforceCommentRate({ clientAddress: clientAddress(req.headers) });
  const shared = await readSharedKit(link);
  const comment = await createComment(link.workspaceId, link.kitId, { kind: "shared", shareLinkId: link.id, name: body.authorName }, body, READER, shared.revision);
  await noticeCommentPosted(link.workspaceId, { id: link.kitId, name: shared.kitName }, null, comment);
  return Response.json({ comment }, { status: 201 });
});
