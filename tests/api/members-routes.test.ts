import { beforeAll, describe, expect, it } from "vitest";
import * as memberRoute from "@/app/api/workspaces/[workspaceId]/members/[memberId]/route";
import * as membersRoute from "@/app/api/workspaces/[workspaceId]/members/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { call, signUp } from "../helpers/api";

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
  it("an owner adds an existing user by e-mail with a role", async () => {
    const res = await call<P>(membersRoute.POST, "POST", path(), { workspaceId: ws }, { cookie: owner.cookie, body: { email: admin.email.toUpperCase(), role: "admin" } });
    expect(res.status).toBe(201);
    expect(res.json.member).toMatchObject({ email: admin.email, role: "admin", name: "Aksel Brun" });
  });

  it("an admin adds an editor, but may not grant owner", async () => {
    const ok = await call<P>(membersRoute.POST, "POST", path(), { workspaceId: ws }, { cookie: admin.cookie, body: { email: editor.email, role: "editor" } });
    expect(ok.status).toBe(201);
    const owner2 = await call<M>(memberRoute.PATCH, "PATCH", `${path()}/x`, { workspaceId: ws, memberId: await memberIdOf(editor.email) }, { cookie: admin.cookie, body: { role: "owner" } });
    expect(owner2.status).toBe(403);
  });

  it("an editor may list members but not add or remove them", async () => {
    const list = await call<P>(membersRoute.GET, "GET", path(), { workspaceId: ws }, { cookie: editor.cookie });
    expect(list.status).toBe(200);
    expect(list.json.members.map((m: { role: string }) => m.role).sort()).toEqual(["admin", "editor", "owner"]);
    const add = await call<P>(membersRoute.POST, "POST", path(), { workspaceId: ws }, { cookie: editor.cookie, body: { email: owner.email, role: "viewer" } });
    expect(add.status).toBe(403);
  });

  it("unknown e-mail → 404 naming email; duplicate → 409; bad role → 422 naming role", async () => {
    const unknown = await call<P>(membersRoute.POST, "POST", path(), { workspaceId: ws }, { cookie: owner.cookie, body: { email: "ghost@test.example", role: "viewer" } });
    expect(unknown.status).toBe(404);
    expect(unknown.json.error.fields[0].path).toBe("email");
    const dup = await call<P>(membersRoute.POST, "POST", path(), { workspaceId: ws }, { cookie: owner.cookie, body: { email: editor.email, role: "viewer" } });
    expect(dup.status).toBe(409);
    const bad = await call<P>(membersRoute.POST, "POST", path(), { workspaceId: ws }, { cookie: owner.cookie, body: { email: editor.email, role: "superuser" } });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields[0].path).toBe("role");
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
