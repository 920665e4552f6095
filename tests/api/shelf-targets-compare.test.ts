// The shelf (seeded from the engine's catalogue with its sources; an edit lists the kits it changes and
// changes them only once confirmed), the workspace's targets, and the comparison route.
import { beforeAll, describe, expect, it } from "vitest";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as revisionsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/revisions/route";
import * as compareRoute from "@/app/api/workspaces/[workspaceId]/compare/route";
import * as targetsRoute from "@/app/api/workspaces/[workspaceId]/targets/route";
import * as shelfRoute from "@/app/api/workspaces/[workspaceId]/shelf/route";
import * as shelfItemRoute from "@/app/api/workspaces/[workspaceId]/shelf/[itemId]/route";
import * as shelfKitsRoute from "@/app/api/workspaces/[workspaceId]/shelf/[itemId]/kits/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { applyShelfItem, type ShelfItem } from "@/contracts/shelf";
import { DEFAULT_TARGETS } from "@/contracts/targets";
import { analyzeLayout, DRIVE_JOINT_TYPES, MATERIALS } from "@/engine";
import { call, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";

let owner: Awaited<ReturnType<typeof signUp>>;
let admin: Awaited<ReturnType<typeof signUp>>;
let ws: string;
let otherWs: string;
let otherCookie: string;

const W = () => ({ workspaceId: ws });
const I = (itemId: string) => ({ workspaceId: ws, itemId });
const shelfPath = (id = "") => `/api/workspaces/${ws}/shelf${id ? `/${id}` : ""}`;

async function shelf(): Promise<ShelfItem[]> {
  const res = await call(shelfRoute.GET, "GET", shelfPath(), W(), { cookie: owner.cookie });
  expect(res.status).toBe(200);
  return res.json.items;
}
async function kitWith(name: string, layout: Layout) {
  const res = await call(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, W(), { cookie: owner.cookie, body: { name, scale: "1:10", layout } });
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  return res.json.kit as { id: string; version: number; layout: Layout };
}
const getKit = async (id: string) => (await call(kitRoute.GET, "GET", `/api/workspaces/${ws}/kits/${id}`, { workspaceId: ws, kitId: id }, { cookie: owner.cookie })).json.kit;
const patchItem = (id: string, body: unknown) => call(shelfItemRoute.PATCH, "PATCH", shelfPath(id), I(id), { cookie: owner.cookie, body });

beforeAll(async () => {
  owner = await signUp("Tamsin Greaves");
  admin = await signUp("Aurel Dunmore");
  const other = await signUp("Piet Olander");
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie })).json.workspaces[0].id;
  otherWs = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: other.cookie })).json.workspaces[0].id;
  otherCookie = other.cookie;
  await addMemberByInvitation(owner, ws, admin, "admin");
});

describe("the shelf is seeded from the engine's catalogue, with sources", () => {
  it("holds every catalogue material and joint kind once, however many readers race to seed it", async () => {
    const all = await Promise.all([shelf(), shelf(), shelf()]);
    const items = all[0]!;
    expect(all.map((a) => a.length)).toEqual([items.length, items.length, items.length]);
    const materials = items.filter((i) => i.kind === "material");
    const joints = items.filter((i) => i.kind === "joint");
    expect(materials).toHaveLength(MATERIALS.length);
    expect(joints).toHaveLength(Object.keys(DRIVE_JOINT_TYPES).length);
    const qt540 = materials.find((m) => m.catalogueId === "aisi-4140-qt-540")!;
    expect(qt540.spec).toMatchObject({ printed: false, tensileYieldMpa: 834, shearRule: "distortion-energy", derate: 1 });
    expect((qt540.spec as { yieldSource: string }).yieldSource).toMatch(/efunda/);
    const pla = materials.find((m) => m.catalogueId === "pla-fff")!;
    expect(pla.spec).toMatchObject({ printed: true, tensileYieldMpa: 35, derate: 0.8 });
    expect((pla.spec as { derateSource: string }).derateSource).toMatch(/common-practice/);
    const cv = joints.find((j) => j.catalogueId === "cv-ball")!;
    expect(cv.spec).toMatchObject({ jointType: "cv-ball", ratedAngleDeg: 45, plungeMm: 0 });
    expect((cv.spec as { ratedAngleSource: string }).ratedAngleSource).toMatch(/NTN Technical Review/);
    expect(joints.find((j) => j.catalogueId === "dogbone")!.spec).toMatchObject({ plungeMm: null });
  });
});

describe("layouts refer to shelf items; editing an item asks before it changes kits", () => {
  it("lists the kits an edit changes (409 confirm_kits), changes them with a revision each once confirmed", async () => {
    const created = await call(shelfRoute.POST, "POST", shelfPath(), W(), {
      cookie: owner.cookie,
      body: { kind: "material", name: "Club 4140 bar", spec: { printed: false, tensileYieldMpa: 800, yieldSource: "supplier certificate 77-A (invented)", shearRule: "distortion-energy", derate: 1, derateSource: "" } },
    });
    expect(created.status).toBe(201);
    const item = created.json.item as ShelfItem;
    const bound = applyShelfItem(TARNWICK_10_BASE, item);
    const a = await kitWith("Shelf kit A", bound);
    const b = await kitWith("Shelf kit B", applyShelfItem(TARNWICK_10_THIN_NECK, item));
    const loose = await kitWith("Shelf kit loose", TARNWICK_10_BASE);
    const using = await call(shelfKitsRoute.GET, "GET", `${shelfPath(item.id)}/kits`, I(item.id), { cookie: owner.cookie });
    expect(using.json.kits.map((k: { name: string }) => k.name)).toEqual(["Shelf kit A", "Shelf kit B"]);
    expect((await shelf()).find((i) => i.id === item.id)!.usedBy).toBe(2);

    const spec = { ...item.spec, tensileYieldMpa: 650, yieldSource: "retested: certificate 77-B (invented)" };
    const ask = await patchItem(item.id, { version: 1, spec });
    expect(ask.status).toBe(409);
    expect(ask.json.error.code).toBe("confirm_kits");
    expect(ask.json.error.kits.map((k: { id: string; version: number }) => [k.id, k.version])).toEqual([[a.id, 1], [b.id, 1]]);
    // Nothing changed yet.
    expect((await getKit(a.id)).version).toBe(1);
    expect((await shelf()).find((i) => i.id === item.id)!.version).toBe(1);

    const done = await patchItem(item.id, { version: 1, spec, kits: ask.json.error.kits.map((k: { id: string; version: number }) => ({ id: k.id, version: k.version })) });
    expect(done.status, JSON.stringify(done.json)).toBe(200);
    expect(done.json.item).toMatchObject({ version: 2, spec: { tensileYieldMpa: 650 } });
    expect(done.json.changedKits.map((k: { name: string; headRevision: number }) => [k.name, k.headRevision])).toEqual([["Shelf kit A", 2], ["Shelf kit B", 2]]);
    const ka = await getKit(a.id);
    expect(ka.layout.strength.material).toMatchObject({ kind: "custom", yieldMpa: 650, source: "retested: certificate 77-B (invented)" });
    expect(ka.layout.shelf).toEqual({ material: item.id });
    const expected = analyzeLayout({ ...bound, strength: { ...bound.strength, material: { ...bound.strength.material, yieldMpa: 650 } } } as Layout);
    expect(ka.readouts.safetyFactor).toBeCloseTo(expected.strength.safetyFactor, 9);
    const revs = (await call(revisionsRoute.GET, "GET", "", { workspaceId: ws, kitId: a.id }, { cookie: owner.cookie })).json.revisions;
    expect(revs[0]).toMatchObject({ number: 2, kind: "shelf", note: "Shelf material “Club 4140 bar” changed", authorName: "Tamsin Greaves" });
    expect((await getKit(loose.id)).version).toBe(1);
  });

  it("a kit saved between the question and the answer: nothing changes, and the question comes again", async () => {
    const item = (await call(shelfRoute.POST, "POST", shelfPath(), W(), {
      cookie: owner.cookie,
      body: { kind: "joint", name: "House CVD 42°", spec: { jointType: "cvd", ratedAngleDeg: 42, ratedAngleSource: "bench test of our own (invented)", plungeMm: 3, plungeSource: "measured (invented)" } },
    })).json.item as ShelfItem;
    const kit = await kitWith("Joint kit", applyShelfItem(TARNWICK_10_BASE, item));
    const spec = { ...item.spec, ratedAngleDeg: 38 };
    const ask = await patchItem(item.id, { version: 1, spec });
    const confirmed = ask.json.error.kits.map((k: { id: string; version: number }) => ({ id: k.id, version: k.version }));
    // Someone saves the kit (still bound to the item) before the confirmation arrives.
    const saved = await call(layoutRoute.PUT, "PUT", "", { workspaceId: ws, kitId: kit.id }, { cookie: admin.cookie, body: { version: 1, layout: { ...kit.layout, frontView: { ...kit.layout.frontView, staticCamberDeg: -2 } } } });
    expect(saved.status).toBe(200);
    const late = await patchItem(item.id, { version: 1, spec, kits: confirmed });
    expect(late.status).toBe(409);
    expect(late.json.error.code).toBe("confirm_kits");
    expect(late.json.error.kits).toMatchObject([{ id: kit.id, version: 2 }]);
    expect((await shelf()).find((i) => i.id === item.id)!.spec).toMatchObject({ ratedAngleDeg: 42 });
    expect((await getKit(kit.id)).layout.drive.ratedAngleDeg).toBe(42);
    // A stale item version is its own 409.
    const stale = await patchItem(item.id, { version: 7, spec, kits: late.json.error.kits.map((k: { id: string; version: number }) => ({ id: k.id, version: k.version })) });
    expect(stale.status).toBe(409);
    expect(stale.json.error.code).toBe("stale_version");
  });

  it("an edit that would make a kit impossible is refused naming the kit; an item in use cannot be deleted", async () => {
    const item = (await call(shelfRoute.POST, "POST", shelfPath(), W(), {
      cookie: owner.cookie,
      body: { kind: "shaft", name: "5 mm turned shaft", spec: { neckDiameterMm: 5, boreDiameterMm: 0, lengthMm: 72, materialId: null } },
    })).json.item as ShelfItem;
    const kit = await kitWith("Shaft kit", applyShelfItem(TARNWICK_10_BASE, item));
    expect(kit.layout.shelf).toEqual({ shaft: item.id });
    // A 9 mm neck does not fit the 8 mm cup mouth.
    const res = await patchItem(item.id, { version: 1, spec: { ...item.spec, neckDiameterMm: 9 } });
    expect(res.status).toBe(422);
    expect(res.json.error.message).toMatch(/^Kit “Shaft kit” would not work with this change: shaft neck/);
    expect(res.json.error.kitId).toBe(kit.id);
    const del = await call(shelfItemRoute.DELETE, "DELETE", shelfPath(item.id), I(item.id), { cookie: owner.cookie });
    expect(del.status).toBe(409);
    expect(del.json.error.code).toBe("in_use");
    expect(del.json.error.message).toMatch(/Shaft kit/);
  });

  it("refuses bad specs with the field named, a name used twice, and a shaft of another kind's id", async () => {
    const bad = await call(shelfRoute.POST, "POST", shelfPath(), W(), { cookie: owner.cookie, body: { kind: "material", name: "Soft", spec: { printed: true, tensileYieldMpa: -3, yieldSource: "x", shearRule: "distortion-energy", derate: 0.5, derateSource: "" } } });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields.map((f: { path: string }) => f.path)).toEqual(["spec.tensileYieldMpa", "spec.derateSource"]);
    const kind = await call(shelfRoute.POST, "POST", shelfPath(), W(), { cookie: owner.cookie, body: { kind: "bearing", name: "x", spec: {} } });
    expect(kind.status).toBe(422);
    expect(kind.json.error.fields[0].path).toBe("kind");
    const joint = (await shelf()).find((i) => i.kind === "joint")!;
    const dup = await call(shelfRoute.POST, "POST", shelfPath(), W(), { cookie: owner.cookie, body: { kind: "joint", name: joint.name, spec: joint.spec } });
    expect(dup.status).toBe(409);
    expect(dup.json.error.code).toBe("name_taken");
    const shaft = await call(shelfRoute.POST, "POST", shelfPath(), W(), { cookie: owner.cookie, body: { kind: "shaft", name: "Odd shaft", spec: { neckDiameterMm: 5, boreDiameterMm: 0, lengthMm: 70, materialId: joint.id } } });
    expect(shaft.status).toBe(422);
    expect(shaft.json.error.fields[0].path).toBe("spec.materialId");
    const patchBad = await patchItem(joint.id, { version: joint.version, spec: { ...joint.spec, ratedAngleDeg: 120 } });
    expect(patchBad.status).toBe(422);
    expect(patchBad.json.error.fields[0].path).toBe("spec.ratedAngleDeg");
  });

  it("an item of another workspace is not found", async () => {
    const theirs = (await call(shelfRoute.GET, "GET", `/api/workspaces/${otherWs}/shelf`, { workspaceId: otherWs }, { cookie: otherCookie })).json.items[0] as ShelfItem;
    const res = await call(shelfItemRoute.GET, "GET", shelfPath(theirs.id), I(theirs.id), { cookie: owner.cookie });
    expect(res.status).toBe(404);
  });
});

describe("targets", () => {
  it("start at the defaults; admins change them with optimistic locking; a bad range is refused", async () => {
    const first = await call(targetsRoute.GET, "GET", "", W(), { cookie: owner.cookie });
    expect(first.json).toMatchObject({ targets: DEFAULT_TARGETS, version: 1 });
    const next = { ...DEFAULT_TARGETS, minLockDeg: 32, ackermannMinPct: 10, ackermannMaxPct: 80 };
    const put = await call(targetsRoute.PUT, "PUT", "", W(), { cookie: admin.cookie, body: { version: 1, targets: next } });
    expect(put.status).toBe(200);
    expect(put.json).toMatchObject({ targets: next, version: 2, updatedByName: "Aurel Dunmore" });
    const stale = await call(targetsRoute.PUT, "PUT", "", W(), { cookie: owner.cookie, body: { version: 1, targets: DEFAULT_TARGETS } });
    expect(stale.status).toBe(409);
    const upside = await call(targetsRoute.PUT, "PUT", "", W(), { cookie: owner.cookie, body: { version: 2, targets: { ...next, ackermannMinPct: 90 } } });
    expect(upside.status).toBe(422);
    expect(upside.json.error.fields[0].path).toBe("targets.ackermannMinPct");
    const missing = await call(targetsRoute.PUT, "PUT", "", W(), { cookie: owner.cookie, body: { version: 2, targets: { minLockDeg: 30 } } });
    expect(missing.status).toBe(422);
    expect(missing.json.error.fields[0].path).toBe("targets.maxJointAngleDeg");
    const library = await call(kitsRoute.GET, "GET", `/api/workspaces/${ws}/kits`, W(), { cookie: owner.cookie });
    expect(library.json.targets).toEqual(next);
  });
});

describe("compare", () => {
  it("answers two to four kits or revisions with their layouts, analyses and effective targets", async () => {
    const a = await kitWith("Compare A", TARNWICK_10_BASE);
    const b = await kitWith("Compare B", TARNWICK_10_THIN_NECK);
    await call(layoutRoute.PUT, "PUT", "", { workspaceId: ws, kitId: b.id }, { cookie: owner.cookie, body: { version: 1, layout: TARNWICK_10_BASE } });
    await call(kitRoute.PATCH, "PATCH", "", { workspaceId: ws, kitId: a.id }, { cookie: owner.cookie, body: { version: 1, targets: { minSafetyFactor: 3 } } });
    const res = await call(compareRoute.GET, "GET", `/api/workspaces/${ws}/compare?items=${a.id},${b.id}@1,${b.id}`, W(), { cookie: owner.cookie });
    expect(res.status).toBe(200);
    const items = res.json.items as { kitName: string; revision: number; isHead: boolean; layout: Layout; analysis: { strength: { safetyFactor: number } }; targets: { minSafetyFactor: number } }[];
    expect(items.map((i) => [i.kitName, i.revision, i.isHead])).toEqual([["Compare A", 1, true], ["Compare B", 1, false], ["Compare B", 2, true]]);
    expect(items[1]!.layout).toEqual(TARNWICK_10_THIN_NECK);
    expect(items[1]!.analysis.strength.safetyFactor).toBeCloseTo(analyzeLayout(TARNWICK_10_THIN_NECK).strength.safetyFactor, 9);
    expect(items[0]!.targets.minSafetyFactor).toBe(3);
    expect(items[1]!.targets.minSafetyFactor).toBe(res.json.workspaceTargets.minSafetyFactor);
  });

  it.each([
    ["one item", (a: string) => a],
    ["five items", (a: string) => [a, `${a}@1`, `${a}@2`, `${a}@3`, `${a}@4`].join(",")],
    ["a malformed id", (a: string) => `${a},nope`],
    ["the same item twice", (a: string) => `${a},${a}`],
    ["revision zero", (a: string) => `${a},${a}@0`],
  ])("refuses %s with 422 naming items", async (_n, items) => {
    const a = await kitWith(`Compare refusal ${Math.random()}`, TARNWICK_10_BASE);
    const res = await call(compareRoute.GET, "GET", `/api/workspaces/${ws}/compare?items=${items(a.id)}`, W(), { cookie: owner.cookie });
    expect(res.status).toBe(422);
    expect(res.json.error.fields[0].path).toBe("items");
  });

  it("a kit of another workspace, or a revision that is not there, is 404", async () => {
    const a = await kitWith("Compare lone", TARNWICK_10_BASE);
    const theirs = await call(kitsRoute.POST, "POST", `/api/workspaces/${otherWs}/kits`, { workspaceId: otherWs }, { cookie: otherCookie, body: { name: "Theirs", scale: "1:10" } });
    const cross = await call(compareRoute.GET, "GET", `/api/workspaces/${ws}/compare?items=${a.id},${theirs.json.kit.id}`, W(), { cookie: owner.cookie });
    expect(cross.status).toBe(404);
    const missing = await call(compareRoute.GET, "GET", `/api/workspaces/${ws}/compare?items=${a.id},${a.id}@5`, W(), { cookie: owner.cookie });
    expect(missing.status).toBe(404);
  });
});
