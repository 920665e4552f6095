// The library table's query, on the real database: server-side paging, sorting on readout columns (missing
// figures last), search over name, tags and author, filters on scale, tags, author, time, readouts and the
// verdict against targets (with a kit's own override), archive and restore, and clear 422s for bad queries.
import { beforeAll, describe, expect, it } from "vitest";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as facetsRoute from "@/app/api/workspaces/[workspaceId]/kits/facets/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE, TARNWICK_10_PRINTED } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { DEFAULT_TARGETS } from "@/contracts/targets";
import { analyzeLayout } from "@/engine";
import { call, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";

let owner: Awaited<ReturnType<typeof signUp>>;
let editor: Awaited<ReturnType<typeof signUp>>;
let ws: string;
const ids: Record<string, string> = {};

const neck = (mm: number): Layout => ({ ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: mm } });
// An impossible layout the engine cannot solve (tie rod far too short to reach): saved, with no readouts.
const unsolvable: Layout = { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, tieRodInner: { x: -20, y: 98.5, z: 36 } } };

type Row = { id: string; name: string; tags: string[]; scale: string; readouts: Record<string, number | null>; archivedAt: string | null; createdByName: string };
const list = async (query: string, cookie = owner.cookie) => {
  const res = await call(kitsRoute.GET, "GET", `/api/workspaces/${ws}/kits?${query}`, { workspaceId: ws }, { cookie });
  return res as { status: number; json: { kits: Row[]; total: number; page: number; size: number; targets: typeof DEFAULT_TARGETS; error?: { fields: { path: string }[] } } };
};
const names = (rows: Row[]) => rows.map((r) => r.name);

beforeAll(async () => {
  owner = await signUp("Odile Farrant");
  editor = await signUp("Bram Hesketh");
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie })).json.workspaces[0].id;
  await addMemberByInvitation(owner, ws, editor, "editor");
  const make = async (name: string, layout: Layout, extra: { scale?: string; tags?: string[] } = {}, who = owner) => {
    const res = await call(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: who.cookie, body: { name, scale: extra.scale ?? "1:10", tags: extra.tags, layout } });
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    ids[name] = res.json.kit.id;
  };
  await make("Alder neck 4.0", neck(4), { tags: ["steel", "race"] });
  await make("Birch neck 4.5", neck(4.5), { tags: ["steel"] });
  await make("Cedar neck 5.0", neck(5), { tags: ["steel", "Race"] }, editor);
  await make("Dogwood neck 6.0", neck(6), { scale: "1:8", tags: ["club"] }, editor);
  await make("Elm printed", TARNWICK_10_PRINTED, { tags: ["printed", "test part"] });
  await make("Fir unsolvable", unsolvable, { tags: ["broken"] });
  await make("Gum 100% odd_name", neck(5.5), { tags: [] });
});

describe("paging and sorting on the server", () => {
  it("sorts by safety factor both ways with the kit that has no figure last, and pages with a total", async () => {
    const sf = (mm: number) => analyzeLayout(neck(mm)).strength.safetyFactor;
    const asc = await list("sort=safetyFactor&dir=asc&size=50");
    expect(asc.status).toBe(200);
    const values = asc.json.kits.map((k) => k.readouts.safetyFactor);
    expect(values.at(-1)).toBeNull();
    const known = values.slice(0, -1) as number[];
    expect(known).toEqual([...known].sort((a, b) => a - b));
    expect(asc.json.kits.find((k) => k.name === "Alder neck 4.0")!.readouts.safetyFactor).toBeCloseTo(sf(4), 9);
    const desc = await list("sort=safetyFactor&dir=desc&size=50");
    expect(desc.json.kits.at(-1)!.name).toBe("Fir unsolvable");
    expect(names(desc.json.kits).slice(0, -1)).toEqual(names(asc.json.kits).slice(0, -1).reverse());

    const p1 = await list("sort=name&dir=asc&size=3&page=1");
    const p3 = await list("sort=name&dir=asc&size=3&page=3");
    expect(p1.json).toMatchObject({ total: 7, page: 1, size: 3 });
    expect(names(p1.json.kits)).toEqual(["Alder neck 4.0", "Birch neck 4.5", "Cedar neck 5.0"]);
    expect(names(p3.json.kits)).toEqual(["Gum 100% odd_name"]);
    const past = await list("sort=name&size=3&page=9");
    expect(past.json).toMatchObject({ total: 7, kits: [] });
  });

  it("sorts by steer lock, joint angle, Ackermann, clearance, author and revision without error", async () => {
    for (const sort of ["lockDeg", "maxJointAngleDeg", "ackermannPct", "neckClearanceMm", "author", "headRevision", "scale", "createdAt"]) {
      const res = await list(`sort=${sort}&dir=asc`);
      expect(res.status, sort).toBe(200);
      expect(res.json.total).toBe(7);
    }
    const lock = (await list("sort=lockDeg&dir=desc")).json.kits.map((k) => k.readouts.lockDeg).filter((v) => v !== null) as number[];
    expect(lock).toEqual([...lock].sort((a, b) => b - a));
  });
});

describe("search and filters", () => {
  it("searches name, tags and author, case-insensitively, taking % and _ literally", async () => {
    expect(names((await list("q=birch")).json.kits)).toEqual(["Birch neck 4.5"]);
    expect(names((await list("q=TEST PART")).json.kits)).toEqual(["Elm printed"]);
    expect(names((await list("q=hesketh&sort=name&dir=asc")).json.kits)).toEqual(["Cedar neck 5.0", "Dogwood neck 6.0"]);
    expect(names((await list("q=100%25")).json.kits)).toEqual(["Gum 100% odd_name"]);
    expect(names((await list("q=d_n")).json.kits)).toEqual(["Gum 100% odd_name"]);
  });

  it("filters by scale, tags (all of them; stored lower-case), author and time", async () => {
    expect(names((await list("scale=1:8")).json.kits)).toEqual(["Dogwood neck 6.0"]);
    expect(names((await list("tags=steel,race&sort=name&dir=asc")).json.kits)).toEqual(["Alder neck 4.0", "Cedar neck 5.0"]);
    const byEditor = await list(`author=${editor.userId}&sort=name&dir=asc`);
    expect(names(byEditor.json.kits)).toEqual(["Cedar neck 5.0", "Dogwood neck 6.0"]);
    const today = new Date().toISOString().slice(0, 10);
    expect((await list(`updatedFrom=${today}&updatedTo=${today}`)).json.total).toBe(7);
    expect((await list("updatedTo=2020-01-01")).json.total).toBe(0);
  });

  it("filters on readout ranges and on what limits the lock", async () => {
    const sf5 = analyzeLayout(neck(5)).strength.safetyFactor;
    const res = await list(`safetyFactorMin=${sf5 - 1e-6}&sort=safetyFactor&dir=asc`);
    expect(names(res.json.kits)).toEqual(["Cedar neck 5.0", "Gum 100% odd_name", "Dogwood neck 6.0"]);
    const printedLimit = analyzeLayout(TARNWICK_10_PRINTED).steerLock.worst.limitedBy;
    expect(names((await list(`limitedBy=${printedLimit}`)).json.kits)).toContain("Elm printed");
  });

  it("judges each kit against the targets, with a kit's own override winning", async () => {
    const sf4 = analyzeLayout(neck(4)).strength.safetyFactor;
    const misses = names((await list("verdict=misses&size=50")).json.kits);
    const meets = names((await list("verdict=meets&size=50")).json.kits);
    // The kit without figures is neither.
    expect(misses).not.toContain("Fir unsolvable");
    expect(meets).not.toContain("Fir unsolvable");
    expect(misses.length + meets.length).toBe(6);
    // Asking more of one kit's strength than it has makes it miss, and only that kit moves.
    const alder = ids["Alder neck 4.0"]!;
    const version = (await call(kitRoute.GET, "GET", `/api/workspaces/${ws}/kits/${alder}`, { workspaceId: ws, kitId: alder }, { cookie: owner.cookie })).json.kit.version;
    const patched = await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${alder}`, { workspaceId: ws, kitId: alder }, { cookie: owner.cookie, body: { version, targets: { minSafetyFactor: sf4 + 1 } } });
    expect(patched.status).toBe(200);
    expect(patched.json.kit.targetOverrides).toEqual({ minSafetyFactor: sf4 + 1 });
    const after = names((await list("verdict=misses&size=50")).json.kits);
    expect(after).toContain("Alder neck 4.0");
    expect(new Set(after)).toEqual(new Set([...misses, "Alder neck 4.0"]));
    await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${alder}`, { workspaceId: ws, kitId: alder }, { cookie: owner.cookie, body: { version: version + 1, targets: {} } });
  });
});

describe("archive and restore", () => {
  it("archived kits leave the default view and come back when restored; nothing is deleted", async () => {
    const id = ids["Birch neck 4.5"]!;
    const get = async () => (await call(kitRoute.GET, "GET", `/api/workspaces/${ws}/kits/${id}`, { workspaceId: ws, kitId: id }, { cookie: editor.cookie })).json.kit;
    const v = (await get()).version;
    const archived = await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${id}`, { workspaceId: ws, kitId: id }, { cookie: editor.cookie, body: { version: v, archived: true } });
    expect(archived.status).toBe(200);
    expect(archived.json.kit.archivedAt).not.toBeNull();
    expect(names((await list("size=50")).json.kits)).not.toContain("Birch neck 4.5");
    expect(names((await list("status=archived")).json.kits)).toEqual(["Birch neck 4.5"]);
    expect((await list("status=all")).json.total).toBe(7);
    const stale = await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${id}`, { workspaceId: ws, kitId: id }, { cookie: editor.cookie, body: { version: v, archived: false } });
    expect(stale.status).toBe(409);
    const restored = await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${id}`, { workspaceId: ws, kitId: id }, { cookie: editor.cookie, body: { version: v + 1, archived: false } });
    expect(restored.json.kit.archivedAt).toBeNull();
    expect(names((await list("size=50")).json.kits)).toContain("Birch neck 4.5");
  });
});

describe("facets", () => {
  it("lists tags and authors with counts", async () => {
    const res = await call(facetsRoute.GET, "GET", `/api/workspaces/${ws}/kits/facets`, { workspaceId: ws }, { cookie: owner.cookie });
    expect(res.status).toBe(200);
    expect(res.json.tags).toContainEqual({ tag: "steel", count: 3 });
    expect(res.json.tags).toContainEqual({ tag: "race", count: 2 });
    expect(res.json.authors).toEqual([
      { id: editor.userId, name: "Bram Hesketh", count: 2 },
      { id: owner.userId, name: "Odile Farrant", count: 5 },
    ]);
  });
});

describe("bad queries and tags are refused with the parameter named", () => {
  it.each([
    ["sort=bogus", "sort"],
    ["dir=up", "dir"],
    ["page=0", "page"],
    ["size=1000", "size"],
    ["scale=1:7", "scale[0]"],
    ["status=deleted", "status"],
    ["safetyFactorMin=abc", "safetyFactorMin"],
    ["updatedFrom=yesterday", "updatedFrom"],
    ["updatedFrom=2026-02-01&updatedTo=2026-01-01", "updatedTo"],
    ["limitedBy=magic", "limitedBy[0]"],
    ["tags=%00bad", "tags[0]"],
    ["colour=red", "(query)"],
  ])("%s → 422 naming %s", async (query, path) => {
    const res = await list(query);
    expect(res.status).toBe(422);
    expect(res.json.error!.fields[0]!.path).toBe(path);
  });

  // Found by tests/api/fuzz-every-route.test.ts: each reached PostgreSQL, which refused it, and the answer was a 500.
  it.each([
    ["q=%00", "q", /control characters/],
    ["q=neck%00", "q", /control characters/],
    ["updatedFrom=0000-01-01", "updatedFrom", /between 0001-01-01 and 9999-12-30/],
    ["updatedTo=0000-01-01", "updatedTo", /between 0001-01-01 and 9999-12-30/],
    ["updatedTo=9999-12-31", "updatedTo", /between 0001-01-01 and 9999-12-30/],
    ["updatedFrom=0001-01-01T00:00:00%2B01:00", "updatedFrom", /between 0001-01-01 and 9999-12-30/],
  ])("%s → 422 naming %s, not a 500 from the database", async (query, path, message) => {
    const res = await list(query);
    expect(res.status).toBe(422);
    expect(res.json.error!.fields[0]).toMatchObject({ path, message: expect.stringMatching(message) });
  });

  it("the widest dates it takes still answer", async () => {
    const res = await list("updatedFrom=0001-01-01&updatedTo=9999-12-30");
    expect(res.status).toBe(200);
    expect(res.json.total).toBe(7);
  });

  it("a tag with a control character, or more than 12 tags, is refused when written", async () => {
    const id = ids["Elm printed"]!;
    const bad = await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${id}`, { workspaceId: ws, kitId: id }, { cookie: owner.cookie, body: { version: 1, tags: ["ok", "bad\u0007"] } });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields[0].path).toBe("tags[1]");
    const many = await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${id}`, { workspaceId: ws, kitId: id }, { cookie: owner.cookie, body: { version: 1, tags: Array.from({ length: 13 }, (_, i) => `t${i}`) } });
    expect(many.status).toBe(422);
    expect(many.json.error.fields[0].path).toBe("tags");
  });

  it("a kit override that turns the Ackermann range upside down is refused, naming it", async () => {
    const id = ids["Elm printed"]!;
    const res = await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${id}`, { workspaceId: ws, kitId: id }, { cookie: owner.cookie, body: { version: 1, targets: { ackermannMinPct: 150 } } });
    expect(res.status).toBe(422);
    expect(res.json.error.fields[0].path).toBe("targets.ackermannMinPct");
  });
});
