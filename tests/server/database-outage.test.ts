// The database going away and coming back, through the real route handlers: with PostgreSQL stopped every
// route answers 503 with Retry-After and stores nothing, readiness says 503 and liveness 200; the first
// request after the restart succeeds; a restart under concurrent writes loses no acknowledged write, answers
// no 500 and raises no uncaught exception (a dropped idle connection is one warning line).
//
// The database here is a cluster of this file's own (tests/helpers/own-database.ts), so stopping it leaves
// the one the other integration tests share alone. The app's modules are imported once DATABASE_URL points
// at it: env.ts reads the environment when it loads.
import { randomUUID } from "node:crypto";
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it, vi, type MockInstance } from "vitest";
import { startOwnDatabase, useDatabaseUrl, type OwnDatabase } from "../helpers/own-database";
import { freePort } from "../helpers/ports";

type P = { workspaceId: string };

let database: OwnDatabase;
let api: typeof import("../helpers/api");
let kitsRoute: typeof import("@/app/api/workspaces/[workspaceId]/kits/route");
let readyRoute: typeof import("@/app/api/health/ready/route");
let liveRoute: typeof import("@/app/api/health/route");
let owner: Awaited<ReturnType<(typeof import("../helpers/api"))["signUp"]>>;
/** Signed up but never seen by a route: its session is not remembered, so resolving it needs the database. */
let unseen: Awaited<ReturnType<(typeof import("../helpers/api"))["signUp"]>>;
let ws: string;
let storedKitNames: () => Promise<string[]>;
let restore: (() => Promise<void>) | undefined;

const uncaught: unknown[] = [];
const onUncaught = (error: unknown) => uncaught.push(error);
let warn: MockInstance<typeof console.warn>;
let error: MockInstance<typeof console.error>;

beforeAll(async () => {
  database = await startOwnDatabase("pg-outage", await freePort());
  restore = useDatabaseUrl(database.url);
  api = await import("../helpers/api");
  kitsRoute = await import("@/app/api/workspaces/[workspaceId]/kits/route");
  readyRoute = await import("@/app/api/health/ready/route");
  liveRoute = await import("@/app/api/health/route");
  const workspacesRoute = await import("@/app/api/workspaces/route");
  const { db } = await import("@/server/db/client");
  const { kits } = await import("@/server/db/schema");
  const { eq } = await import("drizzle-orm");

  owner = await api.signUp("Outage Owner");
  unseen = await api.signUp("Outage Newcomer");
  const list = await api.call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie });
  ws = list.json.workspaces[0].id;
  storedKitNames = async () => (await db.select({ name: kits.name }).from(kits).where(eq(kits.workspaceId, ws))).map((k) => k.name);
}, 180_000);

afterAll(async () => {
  await restore?.(); // ends the pool before the cluster goes
  await database?.remove();
}, 180_000);

beforeEach(() => {
  uncaught.length = 0;
  process.on("uncaughtException", onUncaught);
  process.on("unhandledRejection", onUncaught);
  // Each refused request logs one warning line; they are read here, not printed.
  warn = vi.spyOn(console, "warn").mockImplementation(() => {});
  error = vi.spyOn(console, "error");
});

afterEach(() => {
  process.off("uncaughtException", onUncaught);
  process.off("unhandledRejection", onUncaught);
  vi.restoreAllMocks();
});

const createKit = (name: string) =>
  api.call<P>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner.cookie, body: { name, scale: "1:10" } });
const listKits = () => api.call<P>(kitsRoute.GET, "GET", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner.cookie });
const get = async (handler: () => Response | Promise<Response>) => {
  const res = await handler();
  return { status: res.status, headers: res.headers, json: await res.json() };
};

function expectUnavailable(res: { status: number; headers: Headers; json: { error: { code: string; message: string } } }) {
  expect(res.status).toBe(503);
  expect(res.headers.get("retry-after")).toBe("5");
  expect(res.json.error.code).toBe("data_store_unavailable");
  expect(res.json.error.message).toBe("The data store is unavailable right now, so nothing was changed. Try again in a few seconds.");
}

const warnings = () => warn.mock.calls.map((c) => String(c[0]));

describe("with the database stopped", () => {
  it("writes, reads and sign-ins answer 503 with Retry-After, readiness 503, liveness 200; nothing is stored; the first request after the restart succeeds", async () => {
    expect((await get(readyRoute.GET)).status).toBe(200);
    await database.stop();
    try {
      const name = `Written during the outage ${randomUUID()}`;
      expectUnavailable(await createKit(name));
      expectUnavailable(await listKits());
      const workspacesRoute = await import("@/app/api/workspaces/route");
      expectUnavailable(await api.call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: unseen.cookie }));
      const signIn = await api.signIn(owner.email, owner.password);
      expectUnavailable({ status: signIn.status, headers: signIn.headers, json: await signIn.json() });

      const ready = await get(readyRoute.GET);
      expect(ready.status).toBe(503);
      expect(ready.headers.get("retry-after")).toBe("5");
      expect(ready.json).toMatchObject({ ok: false, database: { ok: false, reason: "ECONNREFUSED" }, error: { code: "data_store_unavailable" } });
      const live = await get(liveRoute.GET);
      expect(live).toMatchObject({ status: 200, json: { ok: true } });

      await database.start();
      // The very next request, with no retry: the pool drops its dead connections and opens new ones.
      const after = await listKits();
      expect(after.status).toBe(200);
      expect(after.json.kits.map((k: { name: string }) => k.name)).not.toContain(name);
      expect(await storedKitNames()).not.toContain(name);
      expect((await get(readyRoute.GET)).status).toBe(200);
    } finally {
      await database.start(); // when an assertion failed during the outage: never leave the next test without it
    }

    // The pool's idle connections were ended by the shutdown: each is one warning line, never an exception.
    const dropped = warnings().filter((w) => w.startsWith("database: an idle connection was closed"));
    expect(dropped.length).toBeGreaterThan(0);
    expect(dropped[0]).toContain("57P01 terminating connection due to administrator command");
    for (const line of warnings()) expect(line).not.toContain("\n");
    expect(warnings().some((w) => /^Data store unavailable in POST \/api\/workspaces\/[^ ]+\/kits: /.test(w))).toBe(true);
    expect(error).not.toHaveBeenCalled();
    expect(uncaught).toEqual([]);
  });
});

describe("a restart under concurrent writes", () => {
  it("loses no acknowledged write, answers only 201 or 503, and raises no uncaught exception", async () => {
    const acknowledged: string[] = [];
    const refused: string[] = [];
    const other: string[] = [];
    let writing = true;
    const writer = async (w: number) => {
      for (let n = 0; writing; n++) {
        const name = `Writer ${w} kit ${n} ${randomUUID().slice(0, 8)}`;
        const res = await createKit(name);
        if (res.status === 201) acknowledged.push(name);
        else if (res.status === 503) {
          refused.push(name);
          await new Promise((r) => setTimeout(r, 25)); // a client backing off, not a busy loop
        } else other.push(`${res.status} ${JSON.stringify(res.json)}`);
      }
    };
    const writers = [0, 1, 2, 3].map(writer);

    const waitForAcks = async (count: number) => {
      const deadline = Date.now() + 30_000;
      while (acknowledged.length < count && Date.now() < deadline) await new Promise((r) => setTimeout(r, 20));
    };
    try {
      await waitForAcks(20);
      await database.stop();
      await new Promise((r) => setTimeout(r, 500));
      await database.start();
      const beforeBack = acknowledged.length;
      await waitForAcks(beforeBack + 20);
    } finally {
      writing = false;
      await Promise.all(writers);
      await database.start();
    }

    console.log(`restart under 4 writers: ${acknowledged.length} writes acknowledged, ${refused.length} answered 503`);
    expect(other).toEqual([]);
    expect(refused.length, "writes met the outage").toBeGreaterThan(0);
    expect(acknowledged.length).toBeGreaterThanOrEqual(40);
    const stored = new Set(await storedKitNames());
    expect(acknowledged.filter((name) => !stored.has(name))).toEqual([]);
    expect(error).not.toHaveBeenCalled();
    expect(uncaught).toEqual([]);
  });
});
