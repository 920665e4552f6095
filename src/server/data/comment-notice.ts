import "server-only";
// The notice a comment sends to the kit's people: every member of the kit's workspace but the writer, one
// message each through the mail outbox (stored, sent in the background, retried). The one call site is
// noticeCommentPosted, called by both comment routes after the comment is stored: a notice that cannot be
// queued is logged and never undoes the comment.
import { and, eq, ne } from "drizzle-orm";
import type { CommentRow } from "@/contracts/sharing";
import { db } from "../db/client";
import { members, users } from "../db/schema";
import { commentNoticeMail, publicUrl, queueMail } from "../mail";

const VIEW_WORDS = { front: "front view", top: "top view", joint: "joint section" } as const;

/** The addresses a comment notice goes to: the workspace's members, the writer left out. */
export async function noticeRecipients(workspaceId: string, writerId: string | null): Promise<string[]> {
  const rows = await db
    .select({ email: users.email })
    .from(members)
    .innerJoin(users, eq(users.id, members.userId))
    .where(writerId ? and(eq(members.organizationId, workspaceId), ne(members.userId, writerId)) : eq(members.organizationId, workspaceId));
  return rows.map((r) => r.email);
}

/** Queues the notice of `comment` to each recipient; answers how many were queued. */
export async function noticeCommentPosted(workspaceId: string, kit: { id: string; name: string }, writerId: string | null, comment: CommentRow): Promise<number> {
  try {
    const to = await noticeRecipients(workspaceId, writerId);
    const content = commentNoticeMail({
      kitName: kit.name,
      authorName: `${comment.authorName}${comment.viaShareLink ? " (through a share link)" : ""}`,
      body: `${comment.body}\n\n(${VIEW_WORDS[comment.view]}, revision ${comment.revision})`,
      url: publicUrl(`/workspaces/${workspaceId}/kits/${kit.id}?revision=${comment.revision}`),
    });
    for (const address of to) await queueMail({ to: address, ...content });
    return to.length;
  } catch (error) {
    console.warn(`Comment notice not queued for comment ${comment.id}: ${(error as Error).message}`);
    return 0;
  }
}
