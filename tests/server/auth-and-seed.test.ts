import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/server/db/client";
import { kits, members, users, workspaces } from "@/server/db/schema";
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_WORKSPACE, seedDemo } from "@/server/data/demo-seed";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { BASE, call, fromAddress, randomClientIp, signIn, signUp, uniqueEmail } from "../helpers/api";

describe("sign-in", () => {
  it("accepts the right password and refuses a wrong one without saying which part was wrong", async () => {
    const u = await signUp("Sable Ruiz");
    const good = await signIn(u.email, u.password, fromAddress("203.0.113.10"));
    expect(good.status).toBe(200);
    expect(good.headers.getSetCookie().join(";")).toMatch(/session_token=/);
    const bad = await signIn(u.email, "not-the-password", fromAddress("203.0.113.10"));
    expect(bad.status).toBe(401);
  });

  it("rate-limits repeated sign-in attempts from one address (10 a minute)", async () => {
    const ip = randomClientIp();
    const email = uniqueEmail("flood");
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) statuses.push((await signIn(email, "wrong-password-1", fromAddress(ip))).status);
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(10)).toEqual([429, 429]);
    // Another address is not affected.
    expect((await signIn(email, "wrong-password-1", fromAddress(randomClientIp()))).status).toBe(401);
  });

  it("gives every new user a personal workspace they own", async () => {
    const u = await signUp("Quill Hartley");
    const rows = await db.select({ role: members.role, name: workspaces.name }).from(members).innerJoin(workspaces, eq(workspaces.id, members.organizationId)).where(eq(members.userId, u.userId));
    expect(rows).toEqual([{ role: "owner", name: "Quill's workspace" }]);
  });
});

describe("demo seed", () => {
  it("is idempotent: a second run adds nothing and keeps the data", async () => {
    const first = await seedDemo();
    const count = async () => (await db.select({ id: kits.id }).from(kits).where(eq(kits.workspaceId, first.workspaceId))).length;
    const kitsAfterFirst = await count();
    expect(kitsAfterFirst).toBeGreaterThanOrEqual(3);
    const second = await seedDemo();
    expect(second).toEqual({ workspaceId: first.workspaceId, created: 0 });
    expect(await count()).toBe(kitsAfterFirst);
    const [ws] = await db.select().from(workspaces).where(eq(workspaces.slug, DEMO_WORKSPACE.slug));
    expect(ws?.name).toBe(DEMO_WORKSPACE.name);
    const roles = await db.select({ email: users.email, role: members.role }).from(members).innerJoin(users, eq(users.id, members.userId)).where(eq(members.organizationId, first.workspaceId));
    expect(new Set(roles.map((r) => `${r.email}:${r.role}`))).toEqual(new Set(DEMO_PEOPLE.map((p) => `${p.email}:${p.role}`)));
  });

  it("its people can sign in with the printed password", async () => {
    await seedDemo();
    const res = await signIn(DEMO_PEOPLE[0]!.email, DEMO_PASSWORD, fromAddress("203.0.113.99"));
    expect(res.status).toBe(200);
  });
});

describe("signing out", () => {
  it("ends the session at once: the same cookie gets 401 on the next call", async () => {
    const u = await signUp("Ilse Marro");
    expect((await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: u.cookie })).status).toBe(200);
    const out = await authPost(new Request(`${BASE}/api/auth/sign-out`, { method: "POST", headers: { cookie: u.cookie, origin: new URL(BASE).origin } }));
    expect(out.status).toBe(200);
    const after = await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: u.cookie });
    expect(after.status).toBe(401);
  });
});
