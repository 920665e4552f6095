// Reference underlays against the real database and the local object store: a picture under the front or top
// view with its placement (two picks a known distance apart), opacity and visibility, replaced and removed with
// its file.
import { beforeAll, describe, expect, it } from "vitest";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as underlaysRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/underlays/route";
import * as underlayRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/underlays/[view]/route";
import * as fileRoute from "@/app/api/workspaces/[workspaceId]/files/[fileId]/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { placeByPicks, type Underlay } from "@/contracts/underlays";
import { call, signUp } from "../helpers/api";
import { download, filesOf, PDF_BYTES, pngBytes, upload } from "../helpers/object-store";

let cookie: string;
let ws: string;
let kit: string;
const V = (view: string) => ({ workspaceId: ws, kitId: kit, view });
const path = (view: string) => `/api/workspaces/${ws}/kits/${kit}/underlays/${view}`;
const placement = { anchorPx: { x: 200, y: 150 }, anchorMm: { u: 80, v: 40 }, mmPerPx: 0.5, rotationDeg: 0, picks: null };
const header = (p: unknown) => ({ "x-underlay-placement": encodeURIComponent(JSON.stringify(p)) });

beforeAll(async () => {
  cookie = (await signUp("Underlay Owner")).cookie;
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie })).json.workspaces[0].id;
  kit = (await call(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie, body: { name: "Underlay kit", scale: "1:10" } })).json.kit.id;
});

describe("underlays", () => {
  it("puts a picture under the front view with its first placement, and lists it", async () => {
    const bytes = await pngBytes(400, 300);
    const res = await upload(underlayRoute.PUT, "PUT", path("front"), V("front"), bytes, { cookie, name: "chassis-front.png", headers: header(placement) });
    expect(res.status).toBe(201);
    const u = res.json.underlay as Underlay;
    expect(u).toMatchObject({ view: "front", placement, opacity: 0.5, visible: true, version: 1, file: { contentType: "image/png", fileName: "chassis-front.png" } });
    const list = await call(underlaysRoute.GET, "GET", `/api/workspaces/${ws}/kits/${kit}/underlays`, { workspaceId: ws, kitId: kit }, { cookie });
    expect(list.json.underlays.map((x: Underlay) => x.view)).toEqual(["front"]);
    const got = await download(fileRoute.GET, u.file.url, { workspaceId: ws, fileId: u.file.id }, cookie);
    expect(got.bytes.equals(bytes)).toBe(true);
  });

  it("scales it by two picks, fades and hides it, with optimistic locking", async () => {
    const a = { x: 100, y: 200 };
    const b = { x: 340, y: 200 };
    const scaled = placeByPicks(placement, a, b, 84, { level: true });
    const res = await call(underlayRoute.PATCH, "PATCH", path("front"), V("front"), { cookie, body: { version: 1, placement: scaled, opacity: 0.35, visible: false } });
    expect(res.status).toBe(200);
    expect(res.json.underlay).toMatchObject({ version: 2, opacity: 0.35, visible: false, placement: { mmPerPx: 0.35, picks: { distanceMm: 84 } } });
    const stale = await call(underlayRoute.PATCH, "PATCH", path("front"), V("front"), { cookie, body: { version: 1, opacity: 0.9 } });
    expect(stale.status).toBe(409);
    const bad = await call(underlayRoute.PATCH, "PATCH", path("front"), V("front"), { cookie, body: { version: 2, opacity: 0 } });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields[0].path).toBe("opacity");
    const samePoint = await call(underlayRoute.PATCH, "PATCH", path("front"), V("front"), { cookie, body: { version: 2, placement: { ...scaled, picks: { aPx: a, bPx: a, distanceMm: 10 } } } });
    expect(samePoint.status).toBe(422);
  });

  it("a new picture replaces the old one, whose file is removed", async () => {
    const before = await filesOf(ws);
    const res = await upload(underlayRoute.PUT, "PUT", path("front"), V("front"), await pngBytes(120, 90), { cookie, name: "redrawn.png" });
    expect(res.status).toBe(201);
    expect(res.json.underlay).toMatchObject({ version: 1, visible: true, file: { fileName: "redrawn.png" } });
    const after = await filesOf(ws);
    expect(after.length).toBe(before.length);
    expect(after).not.toEqual(before);
  });

  it("refuses a wrong type, a bad placement header and an unknown view, storing nothing", async () => {
    const before = await filesOf(ws);
    expect((await upload(underlayRoute.PUT, "PUT", path("top"), V("top"), PDF_BYTES, { cookie, name: "drawing.pdf" })).status).toBe(415);
    const badHeader = await upload(underlayRoute.PUT, "PUT", path("top"), V("top"), await pngBytes(), { cookie, headers: header({ ...placement, mmPerPx: -1 }) });
    expect(badHeader.status).toBe(422);
    expect(badHeader.json.error.fields[0].path).toBe("mmPerPx");
    expect((await upload(underlayRoute.PUT, "PUT", path("side"), V("side"), await pngBytes(), { cookie })).status).toBe(404);
    expect(await filesOf(ws)).toEqual(before);
    const list = await call(underlaysRoute.GET, "GET", `/api/workspaces/${ws}/kits/${kit}/underlays`, { workspaceId: ws, kitId: kit }, { cookie });
    expect(list.json.underlays.map((x: Underlay) => x.view)).toEqual(["front"]);
  });

  it("removing it removes its file", async () => {
    expect((await call(underlayRoute.DELETE, "DELETE", path("front"), V("front"), { cookie })).status).toBe(204);
    expect(await filesOf(ws)).toEqual([]);
    expect((await call(underlayRoute.DELETE, "DELETE", path("front"), V("front"), { cookie })).status).toBe(404);
  });
});
