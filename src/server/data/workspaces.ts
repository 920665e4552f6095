import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, eq, sql } from "drizzle-orm";
import { roleCan, type WorkspaceRole } from "@/contracts/roles";
import { memberIdParam, type MemberRow, type WorkspaceSummary } from "@/contracts/workspaces";
import { db } from "../db/client";
import { members, sessions, users, workspaces } from "../db/schema";
import { HttpError } from "../http/errors";


function slugFrom(name: string): string {
  const base = name.toLowerCase().normalize("NFKD").replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "workspace";
  return `${base}-${randomUUID().slice(0, 8)}`;
}

export async function createWorkspace(input: { name: string; ownerId: string; slug?: string }): Promise<WorkspaceSummary> {
  const id = randomUUID();
  const slug = input.slug ?? slugFrom(input.name);
  await db.transaction(async (tx) => {
    await tx.insert(workspaces).values({ id, name: input.name, slug });
    await tx.insert(members).values({ id: randomUUID(), organizationId: id, userId: input.ownerId, role: "owner" });
  });
  return { id, name: input.name, slug, role: "owner" };
}

export function createPersonalWorkspace(user: { id: string; name: string }): Promise<WorkspaceSummary> {
  const first = user.name.trim().split(/\s+/)[0] || "My";
  return createWorkspace({ name: `${first}'s workspace`, ownerId: user.id });
}

export async function firstWorkspaceIdOf(userId: string): Promise<string | null> {
  const [row] = await db
    .select({ id: members.organizationId })
    .from(members)
    .where(eq(members.userId, userId))
    .orderBy(asc(members.createdAt))
    .limit(1);
  return row?.id ?? null;
}

export async function listWorkspacesOf(userId: string): Promise<WorkspaceSummary[]> {
  return db
    .select({ id: workspaces.id, name: workspaces.name, slug: workspaces.slug, role: members.role })
    .from(members)
    .innerJoin(workspaces, eq(workspaces.id, members.organizationId))
    .where(eq(members.userId, userId))
    .orderBy(asc(members.createdAt));
}

export async function listMembers(workspaceId: string): Promise<MemberRow[]> {
  const rows = await db
    .select({ id: members.id, userId: users.id, name: users.name, email: users.email, role: members.role, createdAt: members.createdAt })
    .from(members)
    .innerJoin(users, eq(users.id, members.userId))
    .where(eq(members.organizationId, workspaceId))
    .orderBy(asc(members.createdAt));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

async function ownerCount(tx: Tx, workspaceId: string): Promise<number> {
  const [row] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(members)
    .where(and(eq(members.organizationId, workspaceId), eq(members.role, "owner")));
  return row?.n ?? 0;
}

function assertMayGrant(actorRole: string, role: WorkspaceRole) {
  if (role === "owner" && actorRole !== "owner") {
    throw new HttpError(403, "forbidden", "Only an owner may make someone an owner.", [{ path: "role", message: "Only an owner may grant owner" }]);
  }
}

/** Adds an existing user (by e-mail) to the workspace. Invitations by e-mail are a separate flow. */
export async function addMemberByEmail(workspaceId: string, actorRole: string, email: string, role: WorkspaceRole): Promise<MemberRow> {
  assertMayGrant(actorRole, role);
  const [user] = await db.select({ id: users.id }).from(users).where(eq(users.email, email.toLowerCase())).limit(1);
  if (!user) {
    throw new HttpError(404, "no_such_user", `No one has signed up with ${email} yet.`, [{ path: "email", message: "No account uses this e-mail address" }]);
  }
  const inserted = await db
    .insert(members)
    .values({ id: randomUUID(), organizationId: workspaceId, userId: user.id, role })
    .onConflictDoNothing()
    .returning({ id: members.id });
  if (inserted.length === 0) {
    throw new HttpError(409, "already_member", `${email} is already a member of this workspace.`, [{ path: "email", message: "Already a member" }]);
  }
  const rows = await listMembers(workspaceId);
  return rows.find((r) => r.id === inserted[0]!.id)!;
}

async function memberOf(tx: Tx, workspaceId: string, memberId: string) {
  const missing = () => new HttpError(404, "not_found", "That member was not found in this workspace.");
  if (!memberIdParam.safeParse(memberId).success) throw missing(); // a malformed id is a member that is not there
  const [row] = await tx
    .select({ id: members.id, role: members.role, userId: members.userId })
    .from(members)
    .where(and(eq(members.organizationId, workspaceId), eq(members.id, memberId)))
    .limit(1);
  if (!row) throw missing();
  return row;
}

const lastOwner = () => new HttpError(409, "last_owner", "A workspace needs at least one owner; name another owner first.");

/**
 * Runs a change to the workspace's members with the workspace row locked (SELECT … FOR UPDATE), so two
 * changes to one workspace run one after the other and each sees the other's result: two owners demoting or
 * removing each other at the same moment cannot both pass the last-owner check. The actor's role is read
 * again under the lock (the guard's reading may be stale by then: a concurrent change may have lowered it).
 */
async function withMembersLocked<T>(workspaceId: string, actorUserId: string, action: "update" | "delete", change: (tx: Tx, actorRole: string) => Promise<T>): Promise<T> {
  return db.transaction(async (tx) => {
    await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.id, workspaceId)).for("update");
    const [me] = await tx
      .select({ role: members.role })
      .from(members)
      .where(and(eq(members.organizationId, workspaceId), eq(members.userId, actorUserId)))
      .limit(1);
    if (!me) throw new HttpError(403, "not_a_member", "You are not a member of this workspace.");
    if (!roleCan(me.role, "member", action)) throw new HttpError(403, "forbidden", `A ${me.role} of this workspace may not ${action} members.`);
    return change(tx, me.role);
  });
}

export async function changeMemberRole(workspaceId: string, actorUserId: string, memberId: string, role: WorkspaceRole): Promise<void> {
  await withMembersLocked(workspaceId, actorUserId, "update", async (tx, actorRole) => {
    const target = await memberOf(tx, workspaceId, memberId);
    assertMayGrant(actorRole, role);
    if (target.role === "owner" && actorRole !== "owner") throw new HttpError(403, "forbidden", "Only an owner may change an owner's role.");
    if (target.role === "owner" && role !== "owner" && (await ownerCount(tx, workspaceId)) <= 1) throw lastOwner();
    await tx.update(members).set({ role }).where(eq(members.id, memberId));
  });
}

export async function removeMember(workspaceId: string, actorUserId: string, memberId: string): Promise<void> {
  await withMembersLocked(workspaceId, actorUserId, "delete", async (tx, actorRole) => {
    const target = await memberOf(tx, workspaceId, memberId);
    if (target.role === "owner" && actorRole !== "owner") throw new HttpError(403, "forbidden", "Only an owner may remove an owner.");
    if (target.role === "owner" && (await ownerCount(tx, workspaceId)) <= 1) throw lastOwner();
    await tx.delete(members).where(eq(members.id, memberId));
  });
}

export async function setActiveWorkspace(sessionId: string, workspaceId: string): Promise<void> {
  await db.update(sessions).set({ activeOrganizationId: workspaceId }).where(eq(sessions.id, sessionId));
}
