import "server-only";
// The notice a comment sends to the kit's people: every member of the kit's workspace but the writer.
// THE ONE CALL SITE for the e-mail: noticeCommentPosted (called by both comment routes, after the comment
// is stored). A failed notice is logged and never undoes the comment.
import { and, eq, ne } from "drizzle-orm";
import type { CommentRow } from "@/contracts/sharing";
import { db } from "../db/client";
import { members, users } from "../db/schema";

export interface CommentNotice {
  readonly to: readonly string[];
  readonly subject: string;
  readonly text: string;
  readonly html: string;
}

const HTML_ESCAPES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };
/** Text for an HTML part: every character markup could use is escaped, so a body reads as typed. */
export const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]!);

const VIEW_WORDS = { front: "front view", top: "top view", joint: "joint section" } as const;

/** The message, plain text and HTML, with the kit's link built from the configured public origin. */
export function commentNotice(recipients: readonly string[], kit: { name: string; url: string }, comment: CommentRow): CommentNotice {
  const where = `${VIEW_WORDS[comment.view]}, revision ${comment.revision}`;
  const who = `${comment.authorName}${comment.viaShareLink ? " (through a share link)" : ""}`;
  const subject = `New comment on ${kit.name.replace(/[\r\n]+/g, " ")}`;
  const text = `${who} commented on ${kit.name} (${where}):\n\n${comment.body}\n\nOpen the kit: ${kit.url}\n`;
  const html =
    `<p>${escapeHtml(who)} commented on <strong>${escapeHtml(kit.name)}</strong> (${escapeHtml(where)}):</p>` +
    `<blockquote style="white-space:pre-wrap">${escapeHtml(comment.body)}</blockquote>` +
    `<p><a href="${escapeHtml(kit.url)}">Open the kit</a></p>`;
  return { to: recipients, subject, text, html };
}

/** The addresses a comment notice goes to: the workspace's members, the writer left out. */
export async function noticeRecipients(workspaceId: string, writerId: string | null): Promise<string[]> {
  const rows = await db
    .select({ email: users.email })
    .from(members)
    .innerJoin(users, eq(users.id, members.userId))
    .where(writerId ? and(eq(members.organizationId, workspaceId), ne(members.userId, writerId)) : eq(members.organizationId, workspaceId));
  return rows.map((r) => r.email);
}

/**
 * Sends the notice of `comment`. Until the mail module (src/server/mail/) is on main, the message is made
 * and not sent: this is the single place to hand it to the mailer.
 */
export async function noticeCommentPosted(workspaceId: string, kit: { id: string; name: string }, writerId: string | null, comment: CommentRow, publicOrigin: string): Promise<CommentNotice | null> {
  try {
    const to = await noticeRecipients(workspaceId, writerId);
    if (to.length === 0) return null;
    const notice = commentNotice(to, { name: kit.name, url: `${publicOrigin}/workspaces/${workspaceId}/kits/${kit.id}?revision=${comment.revision}` }, comment);
    // MAIL: hand `notice` to the mail module here once it lands on main.
    return notice;
  } catch (error) {
    console.warn(`Comment notice not sent for comment ${comment.id}: ${(error as Error).message}`);
    return null;
  }
}
