// Makes someone a member the only way there is: an invitation from the workspace, accepted by the invitee.
import { eq } from "drizzle-orm";
import { expect } from "vitest";
import { db } from "@/server/db/client";
import { users } from "@/server/db/schema";
import * as acceptRoute from "@/app/api/me/invitations/[invitationId]/accept/route";
import * as myInvitationsRoute from "@/app/api/me/invitations/route";
import * as membersRoute from "@/app/api/workspaces/[workspaceId]/members/route";
import { call } from "./api";

type Person = { cookie: string; email: string };

/** The invitee's open invitation to `workspaceId`, or undefined. */
export async function invitationTo(invitee: Person, workspaceId: string): Promise<{ id: string; role: string; workspace: { id: string; name: string } } | undefined> {
  const mine = await call(myInvitationsRoute.GET, "GET", "/api/me/invitations", {}, { cookie: invitee.cookie });
  expect(mine.status).toBe(200);
  return mine.json.invitations.find((i: { workspace: { id: string } }) => i.workspace.id === workspaceId);
}

export async function invite(inviter: { cookie: string }, workspaceId: string, email: string, role: string) {
  return call<{ workspaceId: string }>(membersRoute.POST, "POST", `/api/workspaces/${workspaceId}/members`, { workspaceId }, { cookie: inviter.cookie, body: { email, role } });
}

/**
 * Marks the person's address confirmed, as following the link in the sign-up message does (that link is
 * followed for real in tests/server/auth-mail-flows.test.ts): accepting from the list needs it.
 */
export async function confirmAddress(person: { email: string }): Promise<void> {
  await db.update(users).set({ emailVerified: true }).where(eq(users.email, person.email.toLowerCase()));
}

/** Accepts from the invitee's list; a person given with their address has it confirmed first. */
export async function accept(invitee: { cookie: string; email?: string }, invitationId: string) {
  if (invitee.email) await confirmAddress({ email: invitee.email });
  return call<{ invitationId: string }>(acceptRoute.POST, "POST", `/api/me/invitations/${invitationId}/accept`, { invitationId }, { cookie: invitee.cookie });
}

export async function addMemberByInvitation(inviter: { cookie: string }, workspaceId: string, invitee: Person, role: string): Promise<void> {
  const sent = await invite(inviter, workspaceId, invitee.email, role);
  expect(sent.status).toBe(202);
  const found = await invitationTo(invitee, workspaceId);
  expect(found?.role).toBe(role);
  const accepted = await accept(invitee, found!.id);
  expect(accepted.status).toBe(200);
  expect(accepted.json.role).toBe(role);
}
