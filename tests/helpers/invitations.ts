// Makes someone a member the only way there is: an invitation from the workspace, accepted by the invitee.
import { expect } from "vitest";
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

export async function accept(invitee: { cookie: string }, invitationId: string) {
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
