import "server-only";
// Share links: made, listed and revoked by the kit's editors; opened by anyone holding the token. The token
// is 256 random bits from node:crypto; only its SHA-256 is stored, so the table alone opens nothing.
import { createHash, randomBytes } from "node:crypto";
import { and, desc, eq, gt, isNull, or, sql } from "drizzle-orm";
import { SHARE_TOKEN, sharePath, type ShareLinkCreate, type ShareLinkCreated, type ShareLinkRow } from "@/contracts/sharing";
import { db } from "../db/client";
import { kits, shareLinks, users, workspaces } from "../db/schema";
import { notFound } from "../http/errors";
import { getKit } from "./kits";
import { getRevision } from "./revisions";

const DAY_MS = 86_400_000;

export const hashShareToken = (token: string) => createHash("sha256").update(token, "utf8").digest("hex");

const columns = {
  id: shareLinks.id,
  revision: shareLinks.revision,
  allowComments: shareLinks.allowComments,
  label: shareLinks.label,
  expiresAt: shareLinks.expiresAt,
  revokedAt: shareLinks.revokedAt,
  createdByName: users.name,
  createdAt: shareLinks.createdAt,
};

type Row = { id: string; revision: number | null; allowComments: boolean; label: string; expiresAt: Date | null; revokedAt: Date | null; createdByName: string | null; createdAt: Date };

function toRow(r: Row, now = Date.now()): ShareLinkRow {
  return {
    id: r.id,
    revision: r.revision,
    allowComments: r.allowComments,
    label: r.label,
    expiresAt: r.expiresAt?.toISOString() ?? null,
    revokedAt: r.revokedAt?.toISOString() ?? null,
    createdByName: r.createdByName,
    createdAt: r.createdAt.toISOString(),
    state: r.revokedAt ? "revoked" : r.expiresAt && r.expiresAt.getTime() <= now ? "expired" : "active",
  };
}

/** A new link to the kit (its head, or `revision`, which must exist): the token is in this answer only. */
export async function createShareLink(workspaceId: string, kitId: string, userId: string, body: ShareLinkCreate): Promise<ShareLinkCreated> {
  await getKit(workspaceId, kitId);
  if (body.revision != null) await getRevision(workspaceId, kitId, body.revision);
  const token = randomBytes(32).toString("base64url");
  const [inserted] = await db
    .insert(shareLinks)
    .values({
      workspaceId,
      kitId,
      tokenHash: hashShareToken(token),
      revision: body.revision ?? null,
      allowComments: body.allowComments ?? false,
      label: body.label ?? "",
      expiresAt: body.expiresInDays != null ? new Date(Date.now() + body.expiresInDays * DAY_MS) : null,
      createdBy: userId,
    })
    .returning({ id: shareLinks.id });
  const [row] = await db.select(columns).from(shareLinks).leftJoin(users, eq(users.id, shareLinks.createdBy)).where(eq(shareLinks.id, inserted!.id));
  return { link: toRow(row!), token, path: sharePath(token) };
}

/** Every link of a kit of this workspace, newest first, revoked and expired ones included (marked). */
export async function listShareLinks(workspaceId: string, kitId: string): Promise<ShareLinkRow[]> {
  await getKit(workspaceId, kitId);
  const rows = await db
    .select(columns)
    .from(shareLinks)
    .leftJoin(users, eq(users.id, shareLinks.createdBy))
    .where(and(eq(shareLinks.workspaceId, workspaceId), eq(shareLinks.kitId, kitId)))
    .orderBy(desc(shareLinks.createdAt));
  const now = Date.now();
  return rows.map((r) => toRow(r, now));
}

/** Revokes a link at once (the next request through it is a 404); revoking twice is the same as once. */
export async function revokeShareLink(workspaceId: string, kitId: string, linkId: string): Promise<ShareLinkRow> {
  const [updated] = await db
    .update(shareLinks)
    .set({ revokedAt: sql`coalesce(${shareLinks.revokedAt}, now())` })
    .where(and(eq(shareLinks.workspaceId, workspaceId), eq(shareLinks.kitId, kitId), eq(shareLinks.id, linkId)))
    .returning({ id: shareLinks.id });
  if (!updated) throw notFound("Share link");
  const [row] = await db.select(columns).from(shareLinks).leftJoin(users, eq(users.id, shareLinks.createdBy)).where(eq(shareLinks.id, linkId));
  return toRow(row!);
}

/** What an open link grants: one kit of one workspace, at its head or one revision, comments or not. */
export interface OpenShareLink {
  readonly id: string;
  readonly workspaceId: string;
  readonly workspaceName: string;
  readonly kitId: string;
  /** The revision pinned, or null for the kit's head. */
  readonly revision: number | null;
  readonly allowComments: boolean;
  readonly expiresAt: string | null;
}

/**
 * The link a token opens, or a 404 — the same 404 for a token of the wrong shape, one never made, one
 * revoked and one expired, so the answer tells nothing about which. Checked on every request (no cache),
 * so a revocation holds from the next request on.
 */
export async function openShareLink(token: string): Promise<OpenShareLink> {
  if (!SHARE_TOKEN.test(token)) throw notFound("Share link");
  const [row] = await db
    .select({
      id: shareLinks.id,
      workspaceId: shareLinks.workspaceId,
      workspaceName: workspaces.name,
      kitId: shareLinks.kitId,
      revision: shareLinks.revision,
      allowComments: shareLinks.allowComments,
      expiresAt: shareLinks.expiresAt,
    })
    .from(shareLinks)
    .innerJoin(workspaces, eq(workspaces.id, shareLinks.workspaceId))
    .innerJoin(kits, eq(kits.id, shareLinks.kitId))
    .where(and(eq(shareLinks.tokenHash, hashShareToken(token)), isNull(shareLinks.revokedAt), or(isNull(shareLinks.expiresAt), gt(shareLinks.expiresAt, sql`now()`))))
    .limit(1);
  if (!row) throw notFound("Share link");
  return { ...row, expiresAt: row.expiresAt?.toISOString() ?? null };
}
