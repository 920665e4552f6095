// Point 1 of the hardening issue: two owners changing each other's membership at the same moment must
// never leave a workspace without an owner. Each round restores two owners in the database, then sends
// both requests through the real route handlers at once (Promise.all; the pool holds several connections,
// so both reach PostgreSQL together).
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import * as memberRoute from "@/app/api/workspaces/[workspaceId]/members/[memberId]/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { db } from "@/server/db/client";
import { members } from "@/server/db/schema";
import { call, signUp } from "../helpers/api";

type M = { workspaceId: string; memberId: string };
type Person = Awaited<ReturnType<typeof signUp>>;

let a: Person;
let b: Person;
let ws: string;

const ROUNDS = 30;

/** Puts exactly A and B in the workspace, both owners, with fresh member ids. */
async function twoOwners(): Promise<{ aId: string; bId: string }> {
  const aId = randomUUID();
  const bId = randomUUID();
  await db.transaction(async (tx) => {
    await tx.delete(members).where(eq(members.organizationId, ws));
    await tx.insert(members).values([
      { id: aId, organizationId: ws, userId: a.userId, role: "owner" },
      { id: bId, organizationId: ws, userId: b.userId, role: "owner" },
    ]);
  });
  return { aId, bId };
}

async function ownersLeft(): Promise<number> {
  const rows = await db.select({ id: members.id }).from(members).where(and(eq(members.organizationId, ws), eq(members.role, "owner")));
  return rows.length;
}

const patch = (who: Person, memberId: string, role: string) =>
  call<M>(memberRoute.PATCH, "PATCH", `/api/workspaces/${ws}/members/${memberId}`, { workspaceId: ws, memberId }, { cookie: who.cookie, body: { role } });
const remove = (who: Person, memberId: string) =>
  call<M>(memberRoute.DELETE, "DELETE", `/api/workspaces/${ws}/members/${memberId}`, { workspaceId: ws, memberId }, { cookie: who.cookie });

beforeAll(async () => {
  a = await signUp("Ilse Varga");
  b = await signUp("Teodor Lunn");
  const created = await call(workspacesRoute.POST, "POST", "/api/workspaces", {}, { cookie: a.cookie, body: { name: "Shared bench" } });
  expect(created.status).toBe(201);
  ws = created.json.workspace.id;
});

describe("the last owner under concurrent requests", () => {
  it(`two owners demoting themselves at once: one wins, the other gets 409 last_owner (${ROUNDS} rounds)`, async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const { aId, bId } = await twoOwners();
      const results = await Promise.all([patch(a, aId, "admin"), patch(b, bId, "admin")]);
      expect(await ownersLeft()).toBe(1);
      expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
      expect(results.find((r) => r.status === 409)!.json.error.code).toBe("last_owner");
    }
  });

  it(`two owners removing themselves at once: one leaves, the other gets 409 last_owner (${ROUNDS} rounds)`, async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const { aId, bId } = await twoOwners();
      const results = await Promise.all([remove(a, aId), remove(b, bId)]);
      expect(await ownersLeft()).toBe(1);
      expect(results.map((r) => r.status).sort()).toEqual([204, 409]);
      expect(results.find((r) => r.status === 409)!.json.error.code).toBe("last_owner");
    }
  });

  it(`two owners removing each other at once: one succeeds, the one removed is refused (${ROUNDS} rounds)`, async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const { aId, bId } = await twoOwners();
      const results = await Promise.all([remove(a, bId), remove(b, aId)]);
      const statuses = results.map((r) => r.status).sort();
      expect(await ownersLeft()).toBe(1);
      expect(statuses[0]).toBe(204);
      // The loser is no longer a member by the time its change runs: 403 not_a_member (from the guard, or
      // from the re-check under the lock), never a second 204.
      expect(statuses[1]).toBe(403);
    }
  });

  it(`an owner demoting the other while being demoted leaves one owner (${ROUNDS} rounds)`, async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const { aId, bId } = await twoOwners();
      const results = await Promise.all([patch(a, bId, "editor"), patch(b, aId, "editor")]);
      const statuses = results.map((r) => r.status).sort();
      expect(await ownersLeft()).toBe(1);
      expect(statuses[0]).toBe(200);
      // The loser is an editor by then: 403, it may no longer change members (re-checked under the lock).
      expect(statuses[1]).toBe(403);
    }
  });
});
