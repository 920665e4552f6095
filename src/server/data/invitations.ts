import "server-only";
import { createHash, randomBytes, randomUUID } from "node:crypto";
import { and, asc, eq, gt, inArray, sql } from "drizzle-orm";
import type { WorkspaceRole } from "@/contracts/roles";
import {
  invitationIdParam,
  invitationTokenParam,
  type InvitationMailState,
  type InvitationPreview,
  type InvitationSent,
  type MyInvitationRow,
  type WorkspaceInvitationRow,
} from "@/contracts/workspaces";
import { db } from "../db/client";
import { invitations, mailOutbox, members, users, workspaces } from "../db/schema";
import { HttpError } from "../http/errors";
import { invitationMail, publicUrl, queueMail } from "../mail";
import { assertMayGrant } from "./workspaces";

// Joining a workspace takes the invited person's consent: an admin invites an address, the address gets a
// message with a link carrying an unguessable token, and the person signed in with that address accepts
// (through the link, or from their list once their address is confirmed). Nothing an admin sees tells
// whether the address has an account.

/** How long an invitation stays open; inviting again renews it. */
export const INVITATION_DAYS = 7;

const DAY_MS = 24 * 60 * 60 * 1000;
const gone = () => new HttpError(404, "not_found", "That invitation was not found; it may have been withdrawn, answered or have expired.");

/** A fresh link token and the hash kept of it (the table never holds a usable token). */
function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: tokenHash(token) };
}

function tokenHash(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

/** The page an invitation's link opens. */
export function invitationLink(token: string): string {
  return publicUrl(`/invitations/${token}`);
}

/**
 * Invites `email` to the workspace with `role`. A second invitation to the same address updates the pending
 * one (role, inviter, expiry). An address that is already a member gets the same answer and no row, and
 * their role stays as it is (changing it is PATCH …/members/[memberId]).
 */
export async function inviteToWorkspace(workspaceId: string, inviter: { userId: string; role: string }, email: string, role: WorkspaceRole): Promise<InvitationSent> {
  assertMayGrant(inviter.role, role);
  const address = email.trim().toLowerCase();
  const [member] = await db
    .select({ id: members.id })
    .from(members)
    .innerJoin(users, eq(users.id, members.userId))
    .where(and(eq(members.organizationId, workspaceId), eq(users.email, address)))
    .limit(1);
  if (!member) {
    const expiresAt = new Date(Date.now() + INVITATION_DAYS * DAY_MS);
    // Inviting again renews the pending invitation with a new token: the earlier message's link stops working.
    const { token, hash } = newToken();
    const [stored] = await db
      .insert(invitations)
      .values({ id: randomUUID(), organizationId: workspaceId, email: address, role, status: "pending", inviterId: inviter.userId, expiresAt, tokenHash: hash })
      .onConflictDoUpdate({
        target: [invitations.organizationId, invitations.email],
        targetWhere: sql`${invitations.status} = 'pending'`,
        set: { role, inviterId: inviter.userId, expiresAt, tokenHash: hash },
      })
      .returning({ id: invitations.id });
    // The invitation is stored first; the message goes through the outbox, which retries a failed send.
    const [names] = await db
      .select({ workspace: workspaces.name, inviter: users.name })
      .from(workspaces)
      .innerJoin(users, eq(users.id, inviter.userId))
      .where(eq(workspaces.id, workspaceId));
    const mail = await queueMail({
      to: address,
      ...invitationMail({ workspaceName: names?.workspace ?? "a workspace", inviterName: names?.inviter ?? "Someone", role, url: invitationLink(token), expiresAt }),
    });
    await db.update(invitations).set({ mailId: mail.id }).where(eq(invitations.id, stored!.id));
  }
  return { email: address, role, status: "pending" };
}

/** The workspace's open invitations (pending and not expired), oldest first. */
export async function listWorkspaceInvitations(workspaceId: string): Promise<WorkspaceInvitationRow[]> {
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      invitedBy: users.name,
      createdAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
      mail: mailOutbox.status,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.inviterId))
    .leftJoin(mailOutbox, eq(mailOutbox.id, invitations.mailId))
    .where(and(eq(invitations.organizationId, workspaceId), eq(invitations.status, "pending"), gt(invitations.expiresAt, sql`now()`)))
    .orderBy(asc(invitations.createdAt), asc(invitations.id));
  return rows.map((r) => ({
    ...r,
    role: r.role ?? "viewer",
    createdAt: r.createdAt.toISOString(),
    expiresAt: r.expiresAt.toISOString(),
    mail: (r.mail ?? "pending") as InvitationMailState,
  }));
}

/** Withdraws a pending invitation of the workspace; only an owner withdraws one that would make an owner. */
export async function revokeInvitation(workspaceId: string, actorRole: string, invitationId: string): Promise<void> {
  if (!invitationIdParam.safeParse(invitationId).success) throw gone();
  const where = and(eq(invitations.id, invitationId), eq(invitations.organizationId, workspaceId), eq(invitations.status, "pending"));
  const [row] = await db.select({ role: invitations.role }).from(invitations).where(where).limit(1);
  if (!row) throw gone();
  if (row.role === "owner" && actorRole.split(",").every((r) => r.trim() !== "owner")) {
    throw new HttpError(403, "forbidden", "Only an owner may withdraw an invitation to become an owner.");
  }
  const done = await db.update(invitations).set({ status: "canceled" }).where(where).returning({ id: invitations.id });
  if (done.length === 0) throw gone(); // answered or withdrawn in the meantime
}

/** The open invitations addressed to the signed-in person's e-mail address. */
export async function listMyInvitations(user: { email: string }): Promise<MyInvitationRow[]> {
  const rows = await db
    .select({
      id: invitations.id,
      workspaceId: workspaces.id,
      workspaceName: workspaces.name,
      role: invitations.role,
      invitedBy: users.name,
      createdAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .innerJoin(workspaces, eq(workspaces.id, invitations.organizationId))
    .innerJoin(users, eq(users.id, invitations.inviterId))
    .where(and(eq(invitations.email, user.email.toLowerCase()), eq(invitations.status, "pending"), gt(invitations.expiresAt, sql`now()`)))
    .orderBy(asc(invitations.createdAt), asc(invitations.id));
  return rows.map((r) => ({
    id: r.id,
    workspace: { id: r.workspaceId, name: r.workspaceName },
    role: r.role ?? "viewer",
    invitedBy: r.invitedBy,
    createdAt: r.createdAt.toISOString(),
    expiresAt: r.expiresAt.toISOString(),
  }));
}

export type AcceptedInvitation = { workspace: { id: string; name: string; slug: string }; role: string };

/**
 * Makes the signed-in person a member with the invited role. The invitation row is locked (FOR UPDATE), so
 * a double click runs one accept after the other: the second finds it accepted and answers the same
 * membership. Someone already a member keeps their role. 404 for an invitation to another address, or one
 * withdrawn, declined or expired: the answer never says which.
 */
export async function acceptInvitation(user: { id: string; email: string }, invitationId: string): Promise<AcceptedInvitation> {
  if (!invitationIdParam.safeParse(invitationId).success) throw gone();
  // Anyone can sign up with any address; only a confirmed one (or the invitation's own link) shows it is theirs.
  const [me] = await db.select({ verified: users.emailVerified }).from(users).where(eq(users.id, user.id));
  if (!me?.verified) {
    throw new HttpError(403, "address_unconfirmed", "Confirm your e-mail address first (follow the link we sent when you signed up), or open the link in the invitation's message.");
  }
  return db.transaction(async (tx) => {
    const [inv] = await tx
      .select({ id: invitations.id, workspaceId: invitations.organizationId, role: invitations.role, status: invitations.status, expiresAt: invitations.expiresAt })
      .from(invitations)
      .where(and(eq(invitations.id, invitationId), eq(invitations.email, user.email.toLowerCase())))
      .for("update");
    if (!inv) throw gone();
    if (inv.status === "pending") {
      if (inv.expiresAt.getTime() <= Date.now()) throw gone();
      await tx.insert(members).values({ id: randomUUID(), organizationId: inv.workspaceId, userId: user.id, role: inv.role ?? "viewer" }).onConflictDoNothing();
      await tx.update(invitations).set({ status: "accepted" }).where(eq(invitations.id, inv.id));
    } else if (inv.status !== "accepted") {
      throw gone();
    }
    const [joined] = await tx
      .select({ id: workspaces.id, name: workspaces.name, slug: workspaces.slug, role: members.role })
      .from(members)
      .innerJoin(workspaces, eq(workspaces.id, members.organizationId))
      .where(and(eq(members.organizationId, inv.workspaceId), eq(members.userId, user.id)))
      .limit(1);
    if (!joined) throw gone(); // accepted earlier, and removed from the workspace since
    return { workspace: { id: joined.id, name: joined.name, slug: joined.slug }, role: joined.role };
  });
}

/** Declines an invitation addressed to the signed-in person; declining twice is the same as once. */
export async function declineInvitation(user: { email: string }, invitationId: string): Promise<void> {
  if (!invitationIdParam.safeParse(invitationId).success) throw gone();
  const done = await db
    .update(invitations)
    .set({ status: "rejected" })
    .where(and(eq(invitations.id, invitationId), eq(invitations.email, user.email.toLowerCase()), inArray(invitations.status, ["pending", "rejected"])))
    .returning({ id: invitations.id });
  if (done.length === 0) throw gone();
}

const usedOrExpired = (why: "used" | "expired") =>
  new HttpError(410, `invitation_${why}`, why === "used" ? "This invitation was already used; it works once." : "This invitation has expired. Ask for a new one.");

/** The pending, unexpired invitation a link's token names, for the link's page; null when there is none. */
export async function previewInvitation(token: string): Promise<(InvitationPreview & { status: "open" | "used" | "expired" }) | null> {
  if (!invitationTokenParam.safeParse(token).success) return null;
  const [row] = await db
    .select({
      workspaceId: workspaces.id,
      workspaceName: workspaces.name,
      role: invitations.role,
      invitedBy: users.name,
      email: invitations.email,
      status: invitations.status,
      expiresAt: invitations.expiresAt,
    })
    .from(invitations)
    .innerJoin(workspaces, eq(workspaces.id, invitations.organizationId))
    .innerJoin(users, eq(users.id, invitations.inviterId))
    .where(eq(invitations.tokenHash, tokenHash(token)))
    .limit(1);
  if (!row || row.status === "canceled" || row.status === "rejected") return null;
  const status = row.status === "accepted" ? "used" : row.expiresAt.getTime() <= Date.now() ? "expired" : "open";
  return {
    workspace: { id: row.workspaceId, name: row.workspaceName },
    role: row.role ?? "viewer",
    invitedBy: row.invitedBy,
    email: row.email,
    expiresAt: row.expiresAt.toISOString(),
    status,
  };
}

/**
 * Accepts the invitation a link's token names, for the signed-in person: only when they are signed in with
 * the invited address (403 otherwise), once (410 after), before it expires (410), unless withdrawn (404).
 * Following the link shows the address receives mail, so it also confirms the address.
 */
export async function acceptInvitationByToken(user: { id: string; email: string }, token: string): Promise<AcceptedInvitation> {
  if (!invitationTokenParam.safeParse(token).success) throw gone();
  return db.transaction(async (tx) => {
    const [inv] = await tx
      .select({ id: invitations.id, workspaceId: invitations.organizationId, email: invitations.email, role: invitations.role, status: invitations.status, expiresAt: invitations.expiresAt })
      .from(invitations)
      .where(eq(invitations.tokenHash, tokenHash(token)))
      .for("update");
    if (!inv || inv.status === "canceled" || inv.status === "rejected") throw gone();
    if (inv.status === "accepted") throw usedOrExpired("used");
    if (inv.expiresAt.getTime() <= Date.now()) throw usedOrExpired("expired");
    if (inv.email !== user.email.toLowerCase()) {
      throw new HttpError(403, "wrong_account", "This invitation is for another e-mail address. Sign in with the address it was sent to.");
    }
    await tx.insert(members).values({ id: randomUUID(), organizationId: inv.workspaceId, userId: user.id, role: inv.role ?? "viewer" }).onConflictDoNothing();
    await tx.update(invitations).set({ status: "accepted" }).where(eq(invitations.id, inv.id));
    await tx.update(users).set({ emailVerified: true }).where(and(eq(users.id, user.id), eq(users.email, inv.email)));
    const [joined] = await tx
      .select({ id: workspaces.id, name: workspaces.name, slug: workspaces.slug, role: members.role })
      .from(members)
      .innerJoin(workspaces, eq(workspaces.id, members.organizationId))
      .where(and(eq(members.organizationId, inv.workspaceId), eq(members.userId, user.id)))
      .limit(1);
    return { workspace: { id: joined!.id, name: joined!.name, slug: joined!.slug }, role: joined!.role };
  });
}
