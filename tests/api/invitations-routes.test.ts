import { beforeAll, describe, expect, it } from "vitest";
import * as declineRoute from "@/app/api/me/invitations/[invitationId]/decline/route";
import * as myInvitationsRoute from "@/app/api/me/invitations/route";
import * as invitationRoute from "@/app/api/workspaces/[workspaceId]/invitations/[invitationId]/route";
import * as invitationsRoute from "@/app/api/workspaces/[workspaceId]/invitations/route";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as membersRoute from "@/app/api/workspaces/[workspaceId]/members/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { call, signUp, uniqueEmail } from "../helpers/api";
import { accept, addMemberByInvitation, invitationTo, invite } from "../helpers/invitations";

type P = { workspaceId: string };
type I = { invitationId: string };
type Person = Awaited<ReturnType<typeof signUp>>;

let owner: Person;
let editor: Person;
let viewer: Person;
let ws: string;

async function membersOf(workspaceId: string) {
  const res = await call<P>(membersRoute.GET, "GET", `/api/workspaces/${workspaceId}/members`, { workspaceId }, { cookie: owner.cookie });
  expect(res.status).toBe(200);
  return res.json.members as { userId: string; email: string; role: string }[];
}

async function pendingOf(workspaceId: string, as: Person = owner) {
  return call<P>(invitationsRoute.GET, "GET", `/api/workspaces/${workspaceId}/invitations`, { workspaceId }, { cookie: as.cookie });
}

const kitsOf = (who: Person) => call<P>(kitsRoute.GET, "GET", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: who.cookie });
const decline = (who: Person, invitationId: string) =>
  call<I>(declineRoute.POST, "POST", `/api/me/invitations/${invitationId}/decline`, { invitationId }, { cookie: who.cookie });
const revoke = (who: Person, invitationId: string) =>
  call<P & I>(invitationRoute.DELETE, "DELETE", `/api/workspaces/${ws}/invitations/${invitationId}`, { workspaceId: ws, invitationId }, { cookie: who.cookie });

beforeAll(async () => {
  owner = await signUp("Ilse Varga");
  editor = await signUp("Tomas Reed");
  viewer = await signUp("Nell Ashby");
  const list = await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie });
  ws = list.json.workspaces[0].id;
  await addMemberByInvitation(owner, ws, editor, "editor");
  await addMemberByInvitation(owner, ws, viewer, "viewer");
});

describe("an invitation tells nothing about who has an account", () => {
  it("an address with an account and one without get the same status, body shape and headers", async () => {
    const known = await signUp("Kai Lund");
    const unknownEmail = uniqueEmail("nobody");
    const a = await invite(owner, ws, known.email, "editor");
    const b = await invite(owner, ws, unknownEmail, "editor");
    expect(a.status).toBe(202);
    expect(b.status).toBe(a.status);
    expect(a.json).toEqual({ invitation: { email: known.email, role: "editor", status: "pending" } });
    expect(b.json).toEqual({ invitation: { email: unknownEmail, role: "editor", status: "pending" } });
    expect([...b.headers.keys()].sort()).toEqual([...a.headers.keys()].sort());
    // An existing member (asked with another role) gets that same answer too, and keeps their role.
    const member = await invite(owner, ws, viewer.email, "editor");
    expect(member.status).toBe(202);
    expect(member.json).toEqual({ invitation: { email: viewer.email, role: "editor", status: "pending" } });
    expect((await membersOf(ws)).find((m) => m.email === viewer.email)?.role).toBe("viewer");
    // The admin's list shows both open invitations the same way.
    const pending = await pendingOf(ws);
    const rows = pending.json.invitations.filter((i: { email: string }) => [known.email, unknownEmail].includes(i.email));
    expect(rows.map((r: { role: string; invitedBy: string }) => [r.role, r.invitedBy])).toEqual([["editor", "Ilse Varga"], ["editor", "Ilse Varga"]]);
    expect(pending.json.invitations.some((i: { email: string }) => i.email === viewer.email)).toBe(false);
  });

  it("an address invited before it signs up finds the invitation once signed in", async () => {
    const email = uniqueEmail("later");
    expect((await invite(owner, ws, email.toUpperCase(), "viewer")).status).toBe(202);
    const later = await signUp("Ruth Later", email);
    const found = await invitationTo(later, ws);
    expect(found).toMatchObject({ role: "viewer", workspace: { id: ws, name: "Ilse's workspace" } });
  });
});

describe("joining takes the invitee's consent", () => {
  it("the invitee is not a member until they accept; then they are, with the invited role", async () => {
    const invitee = await signUp("Pia Holm");
    expect((await invite(owner, ws, invitee.email, "editor")).status).toBe(202);
    expect((await kitsOf(invitee)).status).toBe(403);
    expect((await membersOf(ws)).some((m) => m.userId === invitee.userId)).toBe(false);
    const found = await invitationTo(invitee, ws);
    expect(found).toMatchObject({ role: "editor", workspace: { id: ws } });
    const accepted = await accept(invitee, found!.id);
    expect(accepted.status).toBe(200);
    expect(accepted.json).toMatchObject({ role: "editor", workspace: { id: ws, name: "Ilse's workspace" } });
    expect((await kitsOf(invitee)).status).toBe(200);
    expect((await membersOf(ws)).find((m) => m.userId === invitee.userId)?.role).toBe("editor");
    expect(await invitationTo(invitee, ws)).toBeUndefined();
    expect((await pendingOf(ws)).json.invitations.some((i: { email: string }) => i.email === invitee.email)).toBe(false);
  });

  it("declining leaves no membership, and the invitation cannot be accepted afterwards", async () => {
    const invitee = await signUp("Dag Norum");
    await invite(owner, ws, invitee.email, "editor");
    const found = await invitationTo(invitee, ws);
    const declined = await decline(invitee, found!.id);
    expect(declined.status).toBe(204);
    expect((await decline(invitee, found!.id)).status).toBe(204); // twice is the same as once
    expect(await invitationTo(invitee, ws)).toBeUndefined();
    expect((await accept(invitee, found!.id)).status).toBe(404);
    expect((await membersOf(ws)).some((m) => m.userId === invitee.userId)).toBe(false);
    expect((await kitsOf(invitee)).status).toBe(403);
  });

  it("a stranger can neither see, accept nor decline someone else's invitation", async () => {
    const invitee = await signUp("Liv Sand");
    const stranger = await signUp("Bo Strand");
    await invite(owner, ws, invitee.email, "admin");
    const found = await invitationTo(invitee, ws);
    expect(await invitationTo(stranger, ws)).toBeUndefined();
    const stolen = await accept(stranger, found!.id);
    expect(stolen.status).toBe(404);
    expect(stolen.json.error.code).toBe("not_found");
    expect((await decline(stranger, found!.id)).status).toBe(404);
    expect((await membersOf(ws)).some((m) => m.userId === stranger.userId)).toBe(false);
    // Untouched for the person it was meant for.
    expect((await accept(invitee, found!.id)).status).toBe(200);
  });

  it("a malformed or unknown invitation id is 404; anonymous callers get 401", async () => {
    expect((await accept(editor, "no such id!")).status).toBe(404);
    expect((await accept(editor, "3f1c8a9e-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await call(myInvitationsRoute.GET, "GET", "/api/me/invitations", {})).status).toBe(401);
    expect((await accept({ cookie: "" }, "3f1c8a9e-0000-4000-8000-000000000000")).status).toBe(401);
  });

  it("a double click on Accept gives one membership, and both clicks succeed", async () => {
    const invitee = await signUp("Jon Dahl");
    await invite(owner, ws, invitee.email, "viewer");
    const found = await invitationTo(invitee, ws);
    const answers = await Promise.all([accept(invitee, found!.id), accept(invitee, found!.id), accept(invitee, found!.id)]);
    expect(answers.map((a) => a.status)).toEqual([200, 200, 200]);
    expect(answers.map((a) => a.json.role)).toEqual(["viewer", "viewer", "viewer"]);
    expect((await membersOf(ws)).filter((m) => m.userId === invitee.userId)).toHaveLength(1);
  });
});

describe("managing invitations", () => {
  it("inviting an address again updates the pending invitation, never adds a second", async () => {
    const email = uniqueEmail("twice");
    await invite(owner, ws, email, "viewer");
    await invite(owner, ws, ` ${email.toUpperCase()} `, "editor");
    const rows = (await pendingOf(ws)).json.invitations.filter((i: { email: string }) => i.email === email);
    expect(rows).toHaveLength(1);
    expect(rows[0].role).toBe("editor");
  });

  it("a viewer or an editor may not invite, list or withdraw invitations", async () => {
    const email = uniqueEmail("refused");
    for (const who of [viewer, editor]) {
      const sent = await invite(who, ws, email, "viewer");
      expect(sent.status).toBe(403);
      expect(sent.json.error.code).toBe("forbidden");
      expect((await pendingOf(ws, who)).status).toBe(403);
    }
    expect((await pendingOf(ws)).json.invitations.some((i: { email: string }) => i.email === email)).toBe(false);
    await invite(owner, ws, email, "viewer");
    const row = (await pendingOf(ws)).json.invitations.find((i: { email: string }) => i.email === email);
    expect((await revoke(editor, row.id)).status).toBe(403);
    expect((await pendingOf(ws)).json.invitations.some((i: { email: string }) => i.email === email)).toBe(true);
  });

  it("an admin withdraws a pending invitation: it cannot be accepted any more", async () => {
    const invitee = await signUp("Siv Moen");
    await invite(owner, ws, invitee.email, "editor");
    const found = await invitationTo(invitee, ws);
    expect((await revoke(owner, found!.id)).status).toBe(204);
    expect((await revoke(owner, found!.id)).status).toBe(404);
    expect(await invitationTo(invitee, ws)).toBeUndefined();
    expect((await accept(invitee, found!.id)).status).toBe(404);
    expect((await membersOf(ws)).some((m) => m.userId === invitee.userId)).toBe(false);
  });

  it("an invitation to another workspace cannot be withdrawn through this one", async () => {
    const other = await signUp("Ane Berg");
    const otherWs = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: other.cookie })).json.workspaces[0].id;
    const invitee = await signUp("Eli Fosse");
    await invite(other, otherWs, invitee.email, "viewer");
    const found = await invitationTo(invitee, otherWs);
    expect((await revoke(owner, found!.id)).status).toBe(404);
    expect((await invitationTo(invitee, otherWs))?.id).toBe(found!.id);
  });
});
