// Points 3, 4, 5 and 11 of the hardening issue: odd input is refused at the boundary with the field named,
// never a 500 from PostgreSQL or a stack overflow, and a misfit layout is `impossible_geometry`.
import { beforeAll, describe, expect, it } from "vitest";
import * as analyzeRoute from "@/app/api/analyze/route";
import * as memberRoute from "@/app/api/workspaces/[workspaceId]/members/[memberId]/route";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { call, signUp } from "../helpers/api";

type P = { workspaceId: string };
type K = { workspaceId: string; kitId: string };
type M = { workspaceId: string; memberId: string };

let owner: Awaited<ReturnType<typeof signUp>>;
let ws: string;
let kitId: string;

const createKit = (body: unknown) => call<P>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner.cookie, body });
const patchKit = (body: unknown) => call<K>(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${kitId}`, { workspaceId: ws, kitId }, { cookie: owner.cookie, body });
const putLayout = (body: unknown) => call<K>(layoutRoute.PUT, "PUT", `/api/workspaces/${ws}/kits/${kitId}/layout`, { workspaceId: ws, kitId }, { cookie: owner.cookie, body });
const customMaterial = (name: string) => ({
  ...TARNWICK_10_BASE,
  strength: { ...TARNWICK_10_BASE.strength, material: { kind: "custom", name, yieldMpa: 400, source: "supplier sheet", printed: false, derate: 1 } },
});
const currentVersion = async () => (await call<K>(kitRoute.GET, "GET", `/api/workspaces/${ws}/kits/${kitId}`, { workspaceId: ws, kitId }, { cookie: owner.cookie })).json.kit.version as number;

beforeAll(async () => {
  owner = await signUp("Rasmus Odell");
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie })).json.workspaces[0].id;
  const created = await createKit({ name: "Ridge 10 front", scale: "1:10" });
  expect(created.status).toBe(201);
  kitId = created.json.kit.id;
});

describe("control characters in stored strings are refused with the field named (point 3)", () => {
  it.each([
    ["a kit name", () => createKit({ name: "Ridge\u0000", scale: "1:10" }), "name"],
    ["a kit name with a line break", () => createKit({ name: "Ridge\n10", scale: "1:10" }), "name"],
    ["kit notes", () => createKit({ name: "Ridge", scale: "1:10", notes: "cup\u0000mouth" }), "notes"],
    ["kit notes with DEL", () => createKit({ name: "Ridge", scale: "1:10", notes: "cup\u007f" }), "notes"],
    ["a renamed kit", () => patchKit({ version: 1, name: "x\u001b[31m" }), "name"],
    ["a workspace name", () => call(workspacesRoute.POST, "POST", "/api/workspaces", {}, { cookie: owner.cookie, body: { name: "Bench\u0000" } }), "name"],
    ["a custom material's name", () => putLayout({ version: 1, layout: customMaterial("PA12\u0000") }), "layout.strength.material.name"],
    ["a lone surrogate in a material name (jsonb refuses it)", () => createKit({ name: "Ridge", scale: "1:10", layout: customMaterial("PA\ud800") }), "layout.strength.material.name"],
  ])("%s → 422", async (_what, send, path) => {
    const res = await send();
    expect(res.status).toBe(422);
    expect(res.json.error.code).toBe("invalid");
    expect(res.json.error.fields.map((f: { path: string }) => f.path)).toContain(path);
    expect(res.json.error.fields.find((f: { path: string }) => f.path === path).message).toMatch(/control characters/);
  });

  it("notes keep tabs and line breaks", async () => {
    const res = await createKit({ name: "Ridge notes", scale: "1:10", notes: "line one\r\n\tline two" });
    expect(res.status).toBe(201);
    expect(res.json.kit.notes).toBe("line one\r\n\tline two");
  });

  it("a malformed member, kit or workspace id in the path answers 404", async () => {
    for (const memberId of ["bad\u0000id", "x".repeat(65), "ünïcode", "a b"]) {
      const res = await call<M>(memberRoute.PATCH, "PATCH", `/api/workspaces/${ws}/members/x`, { workspaceId: ws, memberId }, { cookie: owner.cookie, body: { role: "viewer" } });
      expect(res.status).toBe(404);
      const del = await call<M>(memberRoute.DELETE, "DELETE", `/api/workspaces/${ws}/members/x`, { workspaceId: ws, memberId }, { cookie: owner.cookie });
      expect(del.status).toBe(404);
    }
    const kit = await call<K>(kitRoute.GET, "GET", `/api/workspaces/${ws}/kits/x`, { workspaceId: ws, kitId: "\u0000" }, { cookie: owner.cookie });
    expect(kit.status).toBe(404);
    const workspace = await call<P>(kitsRoute.GET, "GET", "/api/workspaces/x/kits", { workspaceId: "ws\u0000" }, { cookie: owner.cookie });
    expect(workspace.status).toBe(404);
  });
});

describe("integers beyond their column are refused (point 4)", () => {
  it.each([2 ** 31 - 1, 2 ** 31, 2 ** 40, Number.MAX_SAFE_INTEGER])("version %d in PATCH and PUT → 422 naming version", async (version) => {
    for (const res of [await patchKit({ version, name: "Ridge big" }), await putLayout({ version, layout: TARNWICK_10_BASE })]) {
      expect(res.status).toBe(422);
      expect(res.json.error.fields[0]).toMatchObject({ path: "version", message: "Version must be at most 2147483646" });
    }
  });

  it("the largest accepted version is a stale one (409), not a database error", async () => {
    const res = await patchKit({ version: 2 ** 31 - 2, name: "Ridge" });
    expect(res.status).toBe(409);
    expect(res.json.error.currentVersion).toBe(await currentVersion());
  });
});

describe("over-deep JSON is refused before anything walks it (point 5)", () => {
  const nested = (depth: number, inner = "0") => `${"[".repeat(depth)}${inner}${"]".repeat(depth)}`;

  it("a layout nested 10,000 arrays deep → 422 too_deep on the analysis, kit and workspace routes", async () => {
    const body = `{"layout":${nested(10_000)}}`;
    expect(body.length).toBeLessThan(21_000);
    const sends = [
      call(analyzeRoute.POST, "POST", "/api/analyze", {}, { cookie: owner.cookie, rawBody: body }),
      call<P>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner.cookie, rawBody: `{"name":"x","scale":"1:10","layout":${nested(10_000)}}` }),
      call<K>(layoutRoute.PUT, "PUT", `/api/workspaces/${ws}/kits/${kitId}/layout`, { workspaceId: ws, kitId }, { cookie: owner.cookie, rawBody: `{"version":1,"layout":${nested(10_000, "{}")}}` }),
      call(workspacesRoute.POST, "POST", "/api/workspaces", {}, { cookie: owner.cookie, rawBody: `{"name":${nested(5_000)}}` }),
    ];
    for (const res of await Promise.all(sends)) {
      expect(res.status).toBe(422);
      expect(res.json.error.code).toBe("too_deep");
    }
  });

  it("64 levels are judged by the schema; brackets inside strings do not count", async () => {
    const deepButAllowed = await call(analyzeRoute.POST, "POST", "/api/analyze", {}, { cookie: owner.cookie, rawBody: `{"layout":${nested(63)}}` });
    expect(deepButAllowed.status).toBe(422);
    expect(deepButAllowed.json.error.code).toBe("invalid");
    // 102 characters of brackets, quote and backslash: within the 120-character name limit.
    const brackets = await createKit({ name: `${"[{".repeat(50)}"\\`, scale: "1:10" });
    expect(brackets.status).toBe(201);
    expect(brackets.json.kit.name).toBe(`${"[{".repeat(50)}"\\`);
  });
});

describe("a neck wider than the mouth is impossible_geometry with part and reason (point 11)", () => {
  const wide = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: 9 } };

  it("from the analysis route, as the README says", async () => {
    const res = await call(analyzeRoute.POST, "POST", "/api/analyze", {}, { cookie: owner.cookie, body: { layout: wide } });
    expect(res.status).toBe(422);
    expect(res.json.error).toMatchObject({
      code: "impossible_geometry",
      part: "shaft neck",
      reason: "drive.neckDiameterMm must be smaller than drive.cupMouthDiameterMm",
    });
    expect(res.json.error.fields[0].path).toBe("layout.drive.neckDiameterMm");
  });

  it("from a layout write, and nothing is stored", async () => {
    const before = await currentVersion();
    const res = await putLayout({ version: before, layout: wide });
    expect(res.status).toBe(422);
    expect(res.json.error).toMatchObject({ code: "impossible_geometry", part: "shaft neck" });
    expect(await currentVersion()).toBe(before);
  });

  it("a value out of its range is still invalid, naming the field", async () => {
    const res = await call(analyzeRoute.POST, "POST", "/api/analyze", {}, { cookie: owner.cookie, body: { layout: { ...wide, drive: { ...wide.drive, neckDiameterMm: 0.1 } } } });
    expect(res.status).toBe(422);
    expect(res.json.error.code).toBe("invalid");
    expect(res.json.error.fields[0].path).toBe("layout.drive.neckDiameterMm");
  });
});
