import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import { call, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";

type P = { workspaceId: string };
type K = { workspaceId: string; kitId: string };

let owner: Awaited<ReturnType<typeof signUp>>;
let editor: Awaited<ReturnType<typeof signUp>>;
let viewer: Awaited<ReturnType<typeof signUp>>;
let outsider: Awaited<ReturnType<typeof signUp>>;
let ws: string; // the owner's workspace
let outsiderWs: string;
let kitId: string;

const kitsPath = (w: string) => `/api/workspaces/${w}/kits`;
const kitPath = (w: string, k: string) => `/api/workspaces/${w}/kits/${k}`;

async function personalWorkspace(cookie: string): Promise<string> {
  const res = await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie });
  expect(res.status).toBe(200);
  expect(res.json.workspaces).toHaveLength(1);
  return res.json.workspaces[0].id;
}

beforeAll(async () => {
  owner = await signUp("Wren Castellan");
  editor = await signUp("Edda Marsh");
  viewer = await signUp("Vico Albany");
  outsider = await signUp("Otto Brask");
  ws = await personalWorkspace(owner.cookie);
  outsiderWs = await personalWorkspace(outsider.cookie);
  for (const [who, role] of [[editor, "editor"], [viewer, "viewer"]] as const) await addMemberByInvitation(owner, ws, who, role);
  const created = await call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { cookie: owner.cookie, body: { name: "Gantry 8 front", scale: "1:8" } });
  expect(created.status).toBe(201);
  kitId = created.json.kit.id;
});

describe("anonymous callers get 401 on every kits route", () => {
  it.each([
    ["list", () => call<P>(kitsRoute.GET, "GET", kitsPath(ws), { workspaceId: ws })],
    ["create", () => call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { body: { name: "x", scale: "1:10" } })],
    ["read", () => call<K>(kitRoute.GET, "GET", kitPath(ws, kitId), { workspaceId: ws, kitId })],
    ["rename", () => call<K>(kitRoute.PATCH, "PATCH", kitPath(ws, kitId), { workspaceId: ws, kitId }, { body: { version: 1, name: "y" } })],
    ["layout", () => call<K>(layoutRoute.PUT, "PUT", `${kitPath(ws, kitId)}/layout`, { workspaceId: ws, kitId }, { body: { version: 1, layout: {} } })],
    ["delete", () => call<K>(kitRoute.DELETE, "DELETE", kitPath(ws, kitId), { workspaceId: ws, kitId })],
  ])("%s", async (_name, run) => {
    const res = await run();
    expect(res.status).toBe(401);
    expect(res.json.error.code).toBe("unauthenticated");
  });
});

describe("a member of another workspace learns nothing", () => {
  it("gets the same 403 for an existing kit and a made-up one", async () => {
    const real = await call<K>(kitRoute.GET, "GET", kitPath(ws, kitId), { workspaceId: ws, kitId }, { cookie: outsider.cookie });
    const fake = randomUUID();
    const made = await call<K>(kitRoute.GET, "GET", kitPath(ws, fake), { workspaceId: ws, kitId: fake }, { cookie: outsider.cookie });
    expect(real.status).toBe(403);
    expect(made.status).toBe(403);
    expect(real.json).toEqual(made.json);
  });

  it("gets 403 listing, creating, renaming, replacing the layout and deleting", async () => {
    const o = { cookie: outsider.cookie };
    expect((await call<P>(kitsRoute.GET, "GET", kitsPath(ws), { workspaceId: ws }, o)).status).toBe(403);
    expect((await call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { ...o, body: { name: "x", scale: "1:10" } })).status).toBe(403);
    expect((await call<K>(kitRoute.PATCH, "PATCH", kitPath(ws, kitId), { workspaceId: ws, kitId }, { ...o, body: { version: 1, name: "z" } })).status).toBe(403);
    expect((await call<K>(layoutRoute.PUT, "PUT", `${kitPath(ws, kitId)}/layout`, { workspaceId: ws, kitId }, { ...o, body: { version: 1, layout: {} } })).status).toBe(403);
    expect((await call<K>(kitRoute.DELETE, "DELETE", kitPath(ws, kitId), { workspaceId: ws, kitId }, o)).status).toBe(403);
  });

  it("gets 404 when asking for the kit through its own workspace", async () => {
    const res = await call<K>(kitRoute.GET, "GET", kitPath(outsiderWs, kitId), { workspaceId: outsiderWs, kitId }, { cookie: outsider.cookie });
    expect(res.status).toBe(404);
    const del = await call<K>(kitRoute.DELETE, "DELETE", kitPath(outsiderWs, kitId), { workspaceId: outsiderWs, kitId }, { cookie: outsider.cookie });
    expect(del.status).toBe(404);
    const still = await call<K>(kitRoute.GET, "GET", kitPath(ws, kitId), { workspaceId: ws, kitId }, { cookie: owner.cookie });
    expect(still.status).toBe(200);
  });
});

describe("viewer reads but does not write", () => {
  it("lists and reads", async () => {
    const list = await call<P>(kitsRoute.GET, "GET", kitsPath(ws), { workspaceId: ws }, { cookie: viewer.cookie });
    expect(list.status).toBe(200);
    expect(list.json.kits.map((k: { id: string }) => k.id)).toContain(kitId);
    const read = await call<K>(kitRoute.GET, "GET", kitPath(ws, kitId), { workspaceId: ws, kitId }, { cookie: viewer.cookie });
    expect(read.status).toBe(200);
    expect(read.json.kit.name).toBe("Gantry 8 front");
  });

  it("is refused create, rename, layout and delete with 403", async () => {
    const v = { cookie: viewer.cookie };
    const create = await call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { ...v, body: { name: "x", scale: "1:10" } });
    expect(create.status).toBe(403);
    expect(create.json.error.message).toMatch(/viewer/);
    expect((await call<K>(kitRoute.PATCH, "PATCH", kitPath(ws, kitId), { workspaceId: ws, kitId }, { ...v, body: { version: 1, name: "z" } })).status).toBe(403);
    expect((await call<K>(layoutRoute.PUT, "PUT", `${kitPath(ws, kitId)}/layout`, { workspaceId: ws, kitId }, { ...v, body: { version: 1, layout: {} } })).status).toBe(403);
    expect((await call<K>(kitRoute.DELETE, "DELETE", kitPath(ws, kitId), { workspaceId: ws, kitId }, v)).status).toBe(403);
  });
});

describe("editor writes, with optimistic locking", () => {
  it("creates, renames, and deletes a kit; versions go up by one per write", async () => {
    const e = { cookie: editor.cookie };
    const created = await call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { ...e, body: { name: "Editor's kit", scale: "1:10", notes: "draft" } });
    expect(created.status).toBe(201);
    const id = created.json.kit.id as string;
    expect(created.json.kit.version).toBe(1);
    expect(created.json.kit.createdByName).toBe("Edda Marsh");

    const renamed = await call<K>(kitRoute.PATCH, "PATCH", kitPath(ws, id), { workspaceId: ws, kitId: id }, { ...e, body: { version: 1, name: "Editor's kit v2" } });
    expect(renamed.status).toBe(200);
    expect(renamed.json.kit).toMatchObject({ name: "Editor's kit v2", version: 2, notes: "draft" });

    const deleted = await call<K>(kitRoute.DELETE, "DELETE", kitPath(ws, id), { workspaceId: ws, kitId: id }, e);
    expect(deleted.status).toBe(204);
    const gone = await call<K>(kitRoute.GET, "GET", kitPath(ws, id), { workspaceId: ws, kitId: id }, e);
    expect(gone.status).toBe(404);
  });

  it("a stale version gets 409 and nothing is overwritten", async () => {
    const e = { cookie: editor.cookie };
    const created = await call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { ...e, body: { name: "Race copy", scale: "1:10" } });
    const id = created.json.kit.id as string;
    expect(created.json.kit.updatedByName).toBe("Edda Marsh");
    // The owner saves first; the editor's stale write is told who got there before it.
    const first = await call<K>(kitRoute.PATCH, "PATCH", kitPath(ws, id), { workspaceId: ws, kitId: id }, { cookie: owner.cookie, body: { version: 1, name: "First tab" } });
    expect(first.status).toBe(200);
    expect(first.json.kit.updatedByName).toBe("Wren Castellan");
    const second = await call<K>(kitRoute.PATCH, "PATCH", kitPath(ws, id), { workspaceId: ws, kitId: id }, { ...e, body: { version: 1, name: "Second tab" } });
    expect(second.status).toBe(409);
    expect(second.json.error.currentVersion).toBe(2);
    expect(second.json.error.updatedByName).toBe("Wren Castellan");
    expect(second.json.error.message).toContain("by Wren Castellan");
    expect(second.json.error.fields[0].path).toBe("version");
    const stalelayout = await call<K>(layoutRoute.PUT, "PUT", `${kitPath(ws, id)}/layout`, { workspaceId: ws, kitId: id }, { ...e, body: { version: 1, layout: TARNWICK_10_THIN_NECK } });
    expect(stalelayout.status).toBe(409);
    const now = await call<K>(kitRoute.GET, "GET", kitPath(ws, id), { workspaceId: ws, kitId: id }, e);
    expect(now.json.kit).toMatchObject({ name: "First tab", version: 2 });
  });
});

describe("bad bodies are refused with the field and the reason", () => {
  const post = (opts: Parameters<typeof call>[4]) => call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { cookie: editor.cookie, ...opts });

  it("empty name → 422 naming name", async () => {
    const res = await post({ body: { name: "   ", scale: "1:10" } });
    expect(res.status).toBe(422);
    expect(res.json.error.fields).toContainEqual({ path: "name", message: "Name is required" });
  });

  it("unknown scale → 422 naming scale", async () => {
    const res = await post({ body: { name: "ok", scale: "1:7" } });
    expect(res.status).toBe(422);
    expect(res.json.error.fields[0].path).toBe("scale");
  });

  it("rename without a version → 422 naming version", async () => {
    const res = await call<K>(kitRoute.PATCH, "PATCH", kitPath(ws, kitId), { workspaceId: ws, kitId }, { cookie: editor.cookie, body: { name: "no version" } });
    expect(res.status).toBe(422);
    expect(res.json.error.fields[0].path).toBe("version");
  });

  it("unknown keys → 422", async () => {
    const res = await post({ body: { name: "ok", scale: "1:10", colour: "red" } });
    expect(res.status).toBe(422);
  });

  it("malformed JSON → 400, empty body → 400, wrong media type → 415", async () => {
    expect((await post({ rawBody: "{name:" })).status).toBe(400);
    expect((await post({ rawBody: "" })).json.error.code).toBe("malformed_json");
    expect((await post({ rawBody: "name=x", headers: { "content-type": "application/x-www-form-urlencoded" } })).status).toBe(415);
  });

  it("oversized body → 413, nothing created", async () => {
    const before = await call<P>(kitsRoute.GET, "GET", kitsPath(ws), { workspaceId: ws }, { cookie: editor.cookie });
    const res = await post({ body: { name: "big", scale: "1:10", notes: "x".repeat(400_000) } });
    expect(res.status).toBe(413);
    const after = await call<P>(kitsRoute.GET, "GET", kitsPath(ws), { workspaceId: ws }, { cookie: editor.cookie });
    expect(after.json.kits).toHaveLength(before.json.kits.length);
  });

  it("a malformed kit id is a 404, not a database error", async () => {
    const res = await call<K>(kitRoute.GET, "GET", kitPath(ws, "not-a-uuid"), { workspaceId: ws, kitId: "not-a-uuid" }, { cookie: editor.cookie });
    expect(res.status).toBe(404);
  });
});

describe("layouts stored with a kit", () => {
  it("a new kit without a layout starts from the demo baseline corner", async () => {
    const created = await call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { cookie: editor.cookie, body: { name: "Fresh corner", scale: "1:10" } });
    expect(created.status).toBe(201);
    expect(created.json.kit.layout).toEqual(TARNWICK_10_BASE);
  });

  it("replacing the layout validates it against the layout schema, naming the field", async () => {
    const created = await call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { cookie: editor.cookie, body: { name: "Neck trial", scale: "1:10" } });
    const id = created.json.kit.id as string;
    const bad = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: "thin" } };
    const res = await call<K>(layoutRoute.PUT, "PUT", `${kitPath(ws, id)}/layout`, { workspaceId: ws, kitId: id }, { cookie: editor.cookie, body: { version: 1, layout: bad } });
    expect(res.status).toBe(422);
    expect(res.json.error.fields[0].path).toBe("layout.drive.neckDiameterMm");
    const ok = await call<K>(layoutRoute.PUT, "PUT", `${kitPath(ws, id)}/layout`, { workspaceId: ws, kitId: id }, { cookie: editor.cookie, body: { version: 1, layout: TARNWICK_10_THIN_NECK } });
    expect(ok.status).toBe(200);
    expect(ok.json.kit.version).toBe(2);
    expect(ok.json.kit.layout.drive.neckDiameterMm).toBe(4);
  });

  it("an older (schema 0) document is accepted and comes back upgraded", async () => {
    const { schema: _schema, sideView, topView, strength, frontView, ...rest } = TARNWICK_10_BASE;
    void _schema;
    const { steeringInput, tieRodInner, ...top0 } = topView;
    const { gearRatios, ...strength0 } = strength;
    const old = {
      ...rest,
      frontView: { ...frontView, casterDeg: sideView.casterDeg, casterOffsetMm: sideView.casterOffsetMm },
      topView: { ...top0, rackEnd: tieRodInner, rackTravelMm: (steeringInput as { travelMm: number }).travelMm },
      strength: { ...strength0, gearRatio: gearRatios[0]! * gearRatios[1]! },
    };
    const created = await call<P>(kitsRoute.POST, "POST", kitsPath(ws), { workspaceId: ws }, { cookie: editor.cookie, body: { name: "Old file", scale: "1:10", layout: old } });
    expect(created.status).toBe(201);
    expect(created.json.kit.layout.schema).toBe(2);
    expect(created.json.kit.layout.sideView).toEqual({ casterDeg: 22, casterOffsetMm: -5 });
    expect(created.json.kit.layout.topView.steeringInput).toEqual({ kind: "rack", travelMm: 6.5 });
    expect(created.json.kit.layout.topView.tieRodInner).toEqual(tieRodInner);
  });
});
