import "server-only";
// Comments pinned to the drawing: a thread starts at a point of one view of one revision; replies join it.
// Members write as themselves; a reviewer through a share link that allows comments writes under the
// display name they give. Bodies are stored as typed and always shown as text.
import { and, asc, eq, isNull } from "drizzle-orm";
import type { CommentCreate, CommentRow, CommentThread, CommentView, SharedCommentCreate } from "@/contracts/sharing";
import { db } from "../db/client";
import { kitComments, kitRevisions } from "../db/schema";
import { forbidden, HttpError, notFound } from "../http/errors";
import { getKit } from "./kits";

/** Who reads the list: their own comments, and every comment for an editor, may be deleted. */
export interface CommentReader {
  readonly userId: string | null;
  readonly canModerate: boolean;
}

/** Who writes: a member, or a reviewer through a share link. */
export type CommentAuthor =
  | { readonly kind: "member"; readonly userId: string; readonly name: string }
  | { readonly kind: "shared"; readonly shareLinkId: string; readonly name: string };

const COMMENT_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function commentIdOrNotFound(raw: string): string {
  if (!COMMENT_ID.test(raw)) throw notFound("Comment");
  return raw.toLowerCase();
}

type Row = typeof kitComments.$inferSelect;

function toRow(r: Row, reader: CommentReader): CommentRow {
  return {
    id: r.id,
    revision: r.revision,
    view: r.view as CommentView,
    xMm: r.xMm,
    yMm: r.yMm,
    parentId: r.parentId,
    body: r.body,
    authorName: r.authorName,
    viaShareLink: r.shareLinkId !== null || r.authorId === null,
    resolvedAt: r.resolvedAt?.toISOString() ?? null,
    resolvedByName: r.resolvedByName,
    createdAt: r.createdAt.toISOString(),
    canDelete: reader.canModerate || (reader.userId !== null && r.authorId === reader.userId),
  };
}

/** The kit's threads (oldest first, replies inside), all revisions or one. */
export async function listComments(workspaceId: string, kitId: string, reader: CommentReader, revision: number | null = null): Promise<CommentThread[]> {
  await getKit(workspaceId, kitId);
  const rows = await db
    .select()
    .from(kitComments)
    .where(and(eq(kitComments.workspaceId, workspaceId), eq(kitComments.kitId, kitId), revision === null ? undefined : eq(kitComments.revision, revision)))
    .orderBy(asc(kitComments.createdAt), asc(kitComments.id));
  const threads = new Map<string, CommentThread & { replies: CommentRow[] }>();
  for (const r of rows) if (r.parentId === null) threads.set(r.id, { ...toRow(r, reader), replies: [] });
  for (const r of rows) if (r.parentId !== null) threads.get(r.parentId)?.replies.push(toRow(r, reader));
  return [...threads.values()];
}

async function threadRoot(workspaceId: string, kitId: string, id: string): Promise<Row> {
  const [row] = await db
    .select()
    .from(kitComments)
    .where(and(eq(kitComments.workspaceId, workspaceId), eq(kitComments.kitId, kitId), eq(kitComments.id, id)))
    .limit(1);
  if (!row) throw notFound("Comment");
  if (row.parentId === null) return row;
  return threadRoot(workspaceId, kitId, row.parentId);
}

/**
 * Adds a comment. A new thread's revision must be one of the kit's (`onlyRevision`, for a share link, the
 * one it shows); a reply joins the thread of the comment it answers and takes its pin.
 */
export async function createComment(
  workspaceId: string,
  kitId: string,
  author: CommentAuthor,
  body: CommentCreate | SharedCommentCreate,
  reader: CommentReader,
  onlyRevision: number | null = null,
): Promise<CommentRow> {
  await getKit(workspaceId, kitId);
  let pin: { revision: number; view: CommentView; xMm: number; yMm: number; parentId: string | null };
  if ("parentId" in body) {
    const root = await threadRoot(workspaceId, kitId, commentIdOrNotFound(body.parentId));
    if (onlyRevision !== null && root.revision !== onlyRevision) throw notFound("Comment");
    pin = { revision: root.revision, view: root.view as CommentView, xMm: root.xMm, yMm: root.yMm, parentId: root.id };
  } else {
    if (onlyRevision !== null && body.revision !== onlyRevision) {
      throw new HttpError(422, "invalid", `Invalid body: revision: this link shows revision ${onlyRevision} only`, [{ path: "revision", message: `This link shows revision ${onlyRevision} only` }]);
    }
    const [rev] = await db.select({ n: kitRevisions.number }).from(kitRevisions).where(and(eq(kitRevisions.kitId, kitId), eq(kitRevisions.number, body.revision))).limit(1);
    if (!rev) throw new HttpError(422, "invalid", `Invalid body: revision: the kit has no revision ${body.revision}`, [{ path: "revision", message: `The kit has no revision ${body.revision}` }]);
    pin = { revision: body.revision, view: body.view, xMm: body.xMm, yMm: body.yMm, parentId: null };
  }
  const [row] = await db
    .insert(kitComments)
    .values({
      workspaceId,
      kitId,
      ...pin,
      body: body.body,
      authorId: author.kind === "member" ? author.userId : null,
      shareLinkId: author.kind === "shared" ? author.shareLinkId : null,
      authorName: author.name,
    })
    .returning();
  return toRow(row!, reader);
}

/** Resolves or reopens a thread (a reply's id stands for its thread). */
export async function setThreadResolved(workspaceId: string, kitId: string, rawId: string, resolved: boolean, byName: string, reader: CommentReader): Promise<CommentRow> {
  const root = await threadRoot(workspaceId, kitId, commentIdOrNotFound(rawId));
  const [row] = await db
    .update(kitComments)
    .set(resolved ? { resolvedAt: root.resolvedAt ?? new Date(), resolvedByName: root.resolvedAt ? root.resolvedByName : byName } : { resolvedAt: null, resolvedByName: null })
    .where(and(eq(kitComments.id, root.id), isNull(kitComments.parentId)))
    .returning();
  return toRow(row!, reader);
}

/** Deletes a comment (a thread's first comment takes its replies with it): its author, or an editor. */
export async function deleteComment(workspaceId: string, kitId: string, rawId: string, reader: CommentReader): Promise<void> {
  const id = commentIdOrNotFound(rawId);
  const [row] = await db
    .select({ authorId: kitComments.authorId })
    .from(kitComments)
    .where(and(eq(kitComments.workspaceId, workspaceId), eq(kitComments.kitId, kitId), eq(kitComments.id, id)))
    .limit(1);
  if (!row) throw notFound("Comment");
  if (!reader.canModerate && (reader.userId === null || row.authorId !== reader.userId)) {
    throw forbidden("Only the comment's author or an editor of the workspace may delete it.");
  }
  await db.delete(kitComments).where(eq(kitComments.id, id));
}
