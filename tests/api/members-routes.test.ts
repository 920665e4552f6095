import { beforeAll, describe, expect, it } from "vitest";
import * as memberRoute from "@/app/api/workspaces/[workspaceId]/members/[memberId]/route";
import * as membersRoute from "@/app/api/workspaces/[workspaceId]/members/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { call, signUp } from "../helpers/api";
import { addMemberByInvitation, invite } from "../helpers/invitations";

type P = { workspaceId: string };
type M = { workspaceId: string; memberId: string };

let owner: Awaited<ReturnType<typeof signUp>>;
let admin: Awaited<ReturnType<typeof signUp>>;
let editor: Awaited<ReturnType<typeof signUp>>;
let ws: string;
const path = () => `/api/workspaces/${ws}/members`;

async function memberIdOf(email: string): Promise<string> {
  const res = await call<P>(membersRoute.GET, "GET", path(), { workspaceId: ws }, { cookie: owner.cookie });
  return res.json.members.find((m: { email: string }) => m.email === email).id;
}

beforeAll(async () => {
  owner = await signUp("Maren Holt");
  admin = await signUp("Aksel Brun");
  editor = await signUp("Jory Penn");
  const list = await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie });
  ws = list.json.workspaces[0].id;
  expect(list.json.workspaces[0]).toMatchObject({ name: "Maren's workspace", role: "owner" });
  expect(list.json.activeWorkspaceId).toBe(ws);
});

describe("members", () => {
  it("an owner invites by e-mail with a role; the invitee is a member only once they accept", async () => {
    const sent = await invite(owner, ws, admin.email.toUpperCase(), "admin");
    expect(sent.status).toBe(202);
    expect(sent.json).toEqual({ invitation: { email: admin.email, role: "admin", status: "pending" } });
    const before = await call<P>(membersRoute.GET, "GET", path(), { workspaceId: ws }, { cookie: owner.cookie });
    expect(before.json.members.map((m: { email: string }) => m.email)).toEqual([owner.email]);
    await addMemberByInvitation(owner, ws, admin, "admin");
    const after = await call<P>(membersRoute.GET, "GET", path(), { workspaceId: ws }, { cookie: owner.cookie });
    expect(after.json.members.find((m: { email: string }) => m.email === admin.email)).toMatchObject({ role: "admin", name: "Aksel Brun" });
  });

  it("an admin invites an editor, but may not grant owner", async () => {
    const asOwner = await invite(admin, ws, "someone@test.example", "owner");
    expect(asOwner.status).toBe(403);
    expect(asOwner.json.error.fields[0].path).toBe("role");
    await addMemberByInvitation(admin, ws, editor, "editor");
    const owner2 = await call<M>(memberRoute.PATCH, "PATCH", `${path()}/x`, { workspaceId: ws, memberId: await memberIdOf(editor.email) }, { cookie: admin.cookie, body: { role: "owner" } });
    expect(owner2.status).toBe(403);
  });

  it("an editor may list members but not invite or remove them", async () => {
    const list = await call<P>(membersRoute.GET, "GET", path(), { workspaceId: ws }, { cookie: editor.cookie });
    expect(list.status).toBe(200);
    expect(list.json.members.map((m: { role: string }) => m.role).sort()).toEqual(["admin", "editor", "owner"]);
    const add = await invite(editor, ws, "someone-else@test.example", "viewer");
    expect(add.status).toBe(403);
  });

  it("inviting a member again answers the same way and leaves their role; bad role → 422 naming role; bad e-mail → 422 naming email", async () => {
    const again = await invite(owner, ws, editor.email, "viewer");
    expect(again.status).toBe(202);
    expect(again.json).toEqual({ invitation: { email: editor.email, role: "viewer", status: "pending" } });
    const list = await call<P>(membersRoute.GET, "GET", path(), { workspaceId: ws }, { cookie: owner.cookie });
    expect(list.json.members.find((m: { email: string }) => m.email === editor.email).role).toBe("editor");
    const bad = await invite(owner, ws, editor.email, "superuser");
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields[0].path).toBe("role");
    const badEmail = await invite(owner, ws, "not-an-address", "viewer");
    expect(badEmail.status).toBe(422);
    expect(badEmail.json.error.fields[0].path).toBe("email");
  });

  it("the last owner cannot be demoted or removed", async () => {
    const ownerMember = await memberIdOf(owner.email);
    const demote = await call<M>(memberRoute.PATCH, "PATCH", `${path()}/${ownerMember}`, { workspaceId: ws, memberId: ownerMember }, { cookie: owner.cookie, body: { role: "editor" } });
    expect(demote.status).toBe(409);
    const byAdmin = await call<M>(memberRoute.DELETE, "DELETE", `${path()}/${ownerMember}`, { workspaceId: ws, memberId: ownerMember }, { cookie: admin.cookie });
    expect(byAdmin.status).toBe(403);
  });

  it("an admin changes a role and removes a member", async () => {
    const id = await memberIdOf(editor.email);
    const changed = await call<M>(memberRoute.PATCH, "PATCH", `${path()}/${id}`, { workspaceId: ws, memberId: id }, { cookie: admin.cookie, body: { role: "viewer" } });
    expect(changed.status).toBe(200);
    expect(changed.json.members.find((m: { id: string }) => m.id === id).role).toBe("viewer");
    const removed = await call<M>(memberRoute.DELETE, "DELETE", `${path()}/${id}`, { workspaceId: ws, memberId: id }, { cookie: admin.cookie });
    expect(removed.status).toBe(204);
    const after = await call<P>(membersRoute.GET, "GET", path(), { workspaceId: ws }, { cookie: editor.cookie });
    expect(after.status).toBe(403);
  });
});
