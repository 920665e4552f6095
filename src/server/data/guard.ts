import "server-only";
import { and, eq } from "drizzle-orm";
import { roleCan, type Action, type Resource } from "@/contracts/roles";
import { auth } from "../auth/auth";
import { db } from "../db/client";
import { members, workspaces } from "../db/schema";
import { forbidden, HttpError, unauthorized } from "../http/errors";
import { firstWorkspaceIdOf, setActiveWorkspace } from "./workspaces";

export type SessionUser = { id: string; name: string; email: string };
export type Signed = { user: SessionUser; sessionId: string; activeWorkspaceId: string | null };
export type WorkspaceAccess = Signed & { workspace: { id: string; name: string; slug: string }; role: string };

/** The signed-in user, or a 401. Every page, action and route handler starts here. */
export async function requireSession(headers: Headers): Promise<Signed> {
  const found = await auth.api.getSession({ headers });
  if (!found) throw unauthorized();
  const { user, session } = found;
  let activeWorkspaceId = (session as { activeOrganizationId?: string | null }).activeOrganizationId ?? null;
  if (!activeWorkspaceId) {
    // The sign-up session is created before the personal workspace exists; settle it on first use.
    activeWorkspaceId = await firstWorkspaceIdOf(user.id);
    if (activeWorkspaceId) await setActiveWorkspace(session.id, activeWorkspaceId);
  }
  return { user: { id: user.id, name: user.name, email: user.email }, sessionId: session.id, activeWorkspaceId };
}

const WORKSPACE_ID = /^[A-Za-z0-9_-]{1,64}$/;

/**
 * The session plus the caller's membership of `workspaceId`, checked against one permission.
 * A non-member gets the same 403 whether or not the workspace exists, so nothing leaks.
 */
export async function requireWorkspaceAccess<R extends Resource>(
  headers: Headers,
  workspaceId: string,
  resource: R,
  action: Action<R>,
): Promise<WorkspaceAccess> {
  const signed = await requireSession(headers);
  if (!WORKSPACE_ID.test(workspaceId)) throw new HttpError(403, "not_a_member", "You are not a member of this workspace.");
  const [row] = await db
    .select({ role: members.role, id: workspaces.id, name: workspaces.name, slug: workspaces.slug })
    .from(members)
    .innerJoin(workspaces, eq(workspaces.id, members.organizationId))
    .where(and(eq(members.organizationId, workspaceId), eq(members.userId, signed.user.id)))
    .limit(1);
  if (!row) throw new HttpError(403, "not_a_member", "You are not a member of this workspace.");
  if (!roleCan(row.role, resource, action)) {
    throw forbidden(`A ${row.role} of this workspace may not ${action} ${resource === "organization" ? "the workspace" : `${resource}s`}.`);
  }
  return { ...signed, workspace: { id: row.id, name: row.name, slug: row.slug }, role: row.role };
}
