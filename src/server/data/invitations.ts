import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, eq, gt, inArray, sql } from "drizzle-orm";
import type { WorkspaceRole } from "@/contracts/roles";
import { invitationIdParam, type InvitationSent, type MyInvitationRow, type WorkspaceInvitationRow } from "@/contracts/workspaces";
import { db } from "../db/client";
import { invitations, members, users, workspaces } from "../db/schema";
import { HttpError } from "../http/errors";
import { assertMayGrant } from "./workspaces";

// Joining a workspace takes the invited person's consent: an admin invites an address, the person signed in
// with that address accepts or declines. Nothing an admin sees tells whether the address has an account.

/** How long an invitation stays open; inviting again renews it. */
export const INVITATION_DAYS = 7;

const DAY_MS = 24 * 60 * 60 * 1000;
const gone = () => new HttpError(404, "not_found", "That invitation was not found; it may have been withdrawn, answered or have expired.");

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
    await db
      .insert(invitations)
      .values({ id: randomUUID(), organizationId: workspaceId, email: address, role, status: "pending", inviterId: inviter.userId, expiresAt })
      .onConflictDoUpdate({
        target: [invitations.organizationId, invitations.email],
        targetWhere: sql`${invitations.status} = 'pending'`,
        set: { role, inviterId: inviter.userId, expiresAt },
      });
  }
  return { email: address, role, status: "pending" };
}

/** The workspace's open invitations (pending and not expired), oldest first. */
export async function listWorkspaceInvitations(workspaceId: string): Promise<WorkspaceInvitationRow[]> {
  const rows = await db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, invitedBy: users.name, createdAt: invitations.createdAt, expiresAt: invitations.expiresAt })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.inviterId))
    .where(and(eq(invitations.organizationId, workspaceId), eq(invitations.status, "pending"), gt(invitations.expiresAt, sql`now()`)))
    .orderBy(asc(invitations.createdAt), asc(invitations.id));
  return rows.map((r) => ({ ...r, role: r.role ?? "viewer", createdAt: r.createdAt.toISOString(), expiresAt: r.expiresAt.toISOString() }));
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
