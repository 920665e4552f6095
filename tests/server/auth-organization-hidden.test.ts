// better-auth's organization endpoints are not reachable over HTTP: membership changes go through the
// app's own members and invitations routes only.
import { describe, expect, it } from "vitest";
import { GET as authGet, POST as authPost } from "@/app/api/auth/[...all]/route";
import * as membersRoute from "@/app/api/workspaces/[workspaceId]/members/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { BASE, call, signUp } from "../helpers/api";

const origin = new URL(BASE).origin;
const post = (path: string, cookie: string, body: unknown) =>
  authPost(new Request(`${BASE}${path}`, { method: "POST", headers: { cookie, origin, "content-type": "application/json" }, body: JSON.stringify(body) }));

describe("the auth catch-all hides better-auth's organization endpoints", () => {
  it("an owner's add-member call to /organization/add-member is 404 and adds nobody, in any spelling", async () => {
    const owner = await signUp("Orla Penn");
    const other = await signUp("Taavi Moss");
    const ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie })).json.workspaces[0].id as string;
    for (const path of ["/api/auth/organization/add-member", "/api/auth/Organization/add-member", "/api/auth//organization/add-member"]) {
      const res = await post(path, owner.cookie, { userId: other.userId, role: "admin", organizationId: ws });
      expect(res.status, path).toBe(404);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe("not_found");
    }
    const members = await call<{ workspaceId: string }>(membersRoute.GET, "GET", `/api/workspaces/${ws}/members`, { workspaceId: ws }, { cookie: owner.cookie });
    expect(members.status).toBe(200);
    expect(JSON.stringify(members.json)).not.toContain(other.userId);
  });

  it("reads under /organization/ are 404 too; other auth endpoints still answer", async () => {
    const who = await signUp("Ines Varo");
    const list = await authGet(new Request(`${BASE}/api/auth/organization/list`, { headers: { cookie: who.cookie } }));
    expect(list.status).toBe(404);
    const full = await authGet(new Request(`${BASE}/api/auth/organization/get-full-organization`, { headers: { cookie: who.cookie } }));
    expect(full.status).toBe(404);
    const session = await authGet(new Request(`${BASE}/api/auth/get-session`, { headers: { cookie: who.cookie } }));
    expect(session.status).toBe(200);
    expect(((await session.json()) as { user: { id: string } }).user.id).toBe(who.userId);
  });
});
