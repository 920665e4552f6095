// Revisions against the real database: every save is a numbered revision with its note, author and the
// engine's summary; concurrent saves on one version leave exactly one winner; restore and variants.
import { beforeAll, describe, expect, it } from "vitest";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as revisionsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/revisions/route";
import * as revisionRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/revisions/[revision]/route";
import * as restoreRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/revisions/[revision]/restore/route";
import * as variantsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/variants/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE, TARNWICK_10_CVD, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { analyzeLayout } from "@/engine";
import { call, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";

type P = { workspaceId: string };
type K = { workspaceId: string; kitId: string };
type R = K & { revision: string };

let owner: Awaited<ReturnType<typeof signUp>>;
let editor: Awaited<ReturnType<typeof signUp>>;
let ws: string;

const kitPath = (k: string) => `/api/workspaces/${ws}/kits/${k}`;
const getKit = async (kitId: string) => (await call<K>(kitRoute.GET, "GET", kitPath(kitId), { workspaceId: ws, kitId }, { cookie: owner.cookie })).json.kit;
const revisions = async (kitId: string) => (await call<K>(revisionsRoute.GET, "GET", `${kitPath(kitId)}/revisions`, { workspaceId: ws, kitId }, { cookie: owner.cookie })).json.revisions as {
  number: number; note: string; kind: string; restoredFrom: number | null; authorName: string | null; summary: Record<string, unknown> | null;
}[];
const save = (cookie: string, kitId: string, version: number, layout: Layout, note?: string) =>
  call<K>(layoutRoute.PUT, "PUT", `${kitPath(kitId)}/layout`, { workspaceId: ws, kitId }, { cookie, body: { version, layout, ...(note === undefined ? {} : { note }) } });

async function newKit(name: string, layout: Layout = TARNWICK_10_BASE): Promise<string> {
  const res = await call<P>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner.cookie, body: { name, scale: "1:10", layout } });
  expect(res.status).toBe(201);
  return res.json.kit.id;
}

beforeAll(async () => {
  owner = await signUp("Rhea Vantongeren");
  editor = await signUp("Ilse Marrow");
  const list = await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie });
  ws = list.json.workspaces[0].id;
  await addMemberByInvitation(owner, ws, editor, "editor");
});

describe("a new kit is revision 1, each save the next", () => {
  it("numbers saves, keeps notes and authors, and caches the engine's readouts of each", async () => {
    const id = await newKit("Quarry 10 front");
    const created = await getKit(id);
    expect(created).toMatchObject({ version: 1, headRevision: 1, archivedAt: null, originKitId: null });
    const first = await save(editor.cookie, id, 1, TARNWICK_10_THIN_NECK, "Neck down to 4.0 mm for lock");
    expect(first.status).toBe(200);
    expect(first.json.kit).toMatchObject({ version: 2, headRevision: 2, updatedByName: "Ilse Marrow" });
    const second = await save(owner.cookie, id, 2, TARNWICK_10_CVD);
    expect(second.json.kit.headRevision).toBe(3);

    const list = await revisions(id);
    expect(list.map((r) => r.number)).toEqual([3, 2, 1]);
    expect(list.map((r) => r.kind)).toEqual(["save", "save", "create"]);
    expect(list[1]).toMatchObject({ note: "Neck down to 4.0 mm for lock", authorName: "Ilse Marrow" });
    expect(list[0]).toMatchObject({ note: "", authorName: "Rhea Vantongeren" });

    // The cached summary is the engine's own figure for that layout (same default grid).
    const thin = analyzeLayout(TARNWICK_10_THIN_NECK);
    expect(list[1]!.summary).toMatchObject({ ok: true, lockLimitedBy: thin.steerLock.worst.limitedBy });
    expect(list[1]!.summary!.lockDeg).toBeCloseTo(thin.steerLock.worst.innerDeg, 9);
    expect(list[1]!.summary!.safetyFactor).toBeCloseTo(thin.strength.safetyFactor, 9);
    // …and the library columns follow the head revision.
    const cvd = analyzeLayout(TARNWICK_10_CVD);
    const head = await getKit(id);
    expect(head.readouts.safetyFactor).toBeCloseTo(cvd.strength.safetyFactor, 9);
    expect(head.readouts.lockDeg).toBeCloseTo(cvd.steerLock.worst.innerDeg, 9);
    expect(head.lockLimitedBy).toBe(cvd.steerLock.worst.limitedBy);

    const rev2 = await call<R>(revisionRoute.GET, "GET", `${kitPath(id)}/revisions/2`, { workspaceId: ws, kitId: id, revision: "2" }, { cookie: editor.cookie });
    expect(rev2.status).toBe(200);
    expect(rev2.json.revision.layout).toEqual(TARNWICK_10_THIN_NECK);
  });

  it("a note that is too long or carries control characters is refused, naming note; nothing is saved", async () => {
    const id = await newKit("Quarry 10 notes");
    const long = await save(owner.cookie, id, 1, TARNWICK_10_THIN_NECK, "x".repeat(501));
    expect(long.status).toBe(422);
    expect(long.json.error.fields[0].path).toBe("note");
    const ctrl = await save(owner.cookie, id, 1, TARNWICK_10_THIN_NECK, "bad\u0000note");
    expect(ctrl.status).toBe(422);
    expect((await revisions(id)).map((r) => r.number)).toEqual([1]);
  });

  it("a revision that is not there is 404; so is a malformed number", async () => {
    const id = await newKit("Quarry 10 missing");
    for (const revision of ["2", "0", "-1", "1.5", "01", "abc"]) {
      const res = await call<R>(revisionRoute.GET, "GET", `${kitPath(id)}/revisions/${revision}`, { workspaceId: ws, kitId: id, revision }, { cookie: owner.cookie });
      expect(res.status, revision).toBe(404);
    }
  });
});

describe("two concurrent saves on one version", () => {
  it("one wins, the other gets 409; no revision is lost or duplicated (repeated)", async () => {
    const id = await newKit("Quarry 10 race");
    let version = 1;
    const winners: Layout[] = [];
    for (let round = 0; round < 6; round++) {
      const a: Layout = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: 4 + round * 0.1 } };
      const b: Layout = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: 5.5 + round * 0.1 } };
      const [ra, rb] = await Promise.all([save(owner.cookie, id, version, a, `owner ${round}`), save(editor.cookie, id, version, b, `editor ${round}`)]);
      expect([ra.status, rb.status].sort()).toEqual([200, 409]);
      const lost = ra.status === 409 ? ra : rb;
      expect(lost.json.error.code).toBe("stale_version");
      expect(lost.json.error.currentVersion).toBe(version + 1);
      winners.push(ra.status === 200 ? a : b);
      version += 1;
    }
    const list = await revisions(id);
    // Exactly one revision per round, numbered without gaps or repeats, each the winner's layout and note.
    expect(list.map((r) => r.number)).toEqual([7, 6, 5, 4, 3, 2, 1]);
    for (let round = 0; round < 6; round++) {
      const rev = await call<R>(revisionRoute.GET, "GET", `${kitPath(id)}/revisions/${round + 2}`, { workspaceId: ws, kitId: id, revision: String(round + 2) }, { cookie: owner.cookie });
      expect(rev.json.revision.layout).toEqual(winners[round]);
      expect(rev.json.revision.note).toMatch(new RegExp(`^(owner|editor) ${round}$`));
    }
    const head = await getKit(id);
    expect(head).toMatchObject({ version: 7, headRevision: 7 });
    expect(head.layout).toEqual(winners[5]);
  });
});

describe("restore", () => {
  it("brings an earlier revision back as a new head revision and deletes nothing", async () => {
    const id = await newKit("Quarry 10 restore");
    await save(owner.cookie, id, 1, TARNWICK_10_THIN_NECK, "thin");
    await save(owner.cookie, id, 2, TARNWICK_10_CVD, "cvd");
    const res = await call<R>(restoreRoute.POST, "POST", `${kitPath(id)}/revisions/1/restore`, { workspaceId: ws, kitId: id, revision: "1" }, { cookie: editor.cookie, body: { version: 3, note: "back to the baseline" } });
    expect(res.status).toBe(200);
    expect(res.json.kit).toMatchObject({ version: 4, headRevision: 4 });
    expect(res.json.kit.layout).toEqual(TARNWICK_10_BASE);
    const list = await revisions(id);
    expect(list.map((r) => [r.number, r.kind, r.restoredFrom])).toEqual([[4, "restore", 1], [3, "save", null], [2, "save", null], [1, "create", null]]);
    expect(list[0]).toMatchObject({ note: "back to the baseline", authorName: "Ilse Marrow" });
    expect(list[0]!.summary!.safetyFactor).toBeCloseTo(list[3]!.summary!.safetyFactor as number, 12);
  });

  it("a stale version gets 409 and writes nothing; a revision that is not there is 404", async () => {
    const id = await newKit("Quarry 10 restore stale");
    await save(owner.cookie, id, 1, TARNWICK_10_THIN_NECK);
    const stale = await call<R>(restoreRoute.POST, "POST", `${kitPath(id)}/revisions/1/restore`, { workspaceId: ws, kitId: id, revision: "1" }, { cookie: owner.cookie, body: { version: 1 } });
    expect(stale.status).toBe(409);
    expect(stale.json.error.currentVersion).toBe(2);
    const missing = await call<R>(restoreRoute.POST, "POST", `${kitPath(id)}/revisions/9/restore`, { workspaceId: ws, kitId: id, revision: "9" }, { cookie: owner.cookie, body: { version: 2 } });
    expect(missing.status).toBe(404);
    expect((await revisions(id)).map((r) => r.number)).toEqual([2, 1]);
    const noVersion = await call<R>(restoreRoute.POST, "POST", `${kitPath(id)}/revisions/1/restore`, { workspaceId: ws, kitId: id, revision: "1" }, { cookie: owner.cookie, body: {} });
    expect(noVersion.status).toBe(422);
    expect(noVersion.json.error.fields[0].path).toBe("version");
  });
});

describe("variants", () => {
  it("makes a new kit from the head or from one revision, remembering where it came from", async () => {
    const id = await newKit("Quarry 10 parent");
    await call<K>(kitRoute.PATCH, "PATCH", kitPath(id), { workspaceId: ws, kitId: id }, { cookie: owner.cookie, body: { version: 1, tags: ["Race", "steel"] } });
    await save(owner.cookie, id, 2, TARNWICK_10_THIN_NECK, "thin");
    const fromHead = await call<K>(variantsRoute.POST, "POST", `${kitPath(id)}/variants`, { workspaceId: ws, kitId: id }, { cookie: editor.cookie, body: { name: "Quarry 10 — thin, try" } });
    expect(fromHead.status).toBe(201);
    expect(fromHead.json.kit).toMatchObject({ originKitId: id, originKitName: "Quarry 10 parent", originRevision: 2, version: 1, headRevision: 1, scale: "1:10", tags: ["race", "steel"], createdByName: "Ilse Marrow" });
    expect(fromHead.json.kit.layout).toEqual(TARNWICK_10_THIN_NECK);
    const fromOne = await call<K>(variantsRoute.POST, "POST", `${kitPath(id)}/variants`, { workspaceId: ws, kitId: id }, { cookie: editor.cookie, body: { name: "Quarry 10 — from the start", revision: 1, scale: "1:8" } });
    expect(fromOne.status).toBe(201);
    expect(fromOne.json.kit).toMatchObject({ originRevision: 1, scale: "1:8" });
    expect(fromOne.json.kit.layout).toEqual(TARNWICK_10_BASE);
    const vr = await revisions(fromOne.json.kit.id);
    expect(vr).toHaveLength(1);
    expect(vr[0]).toMatchObject({ number: 1, kind: "variant", note: "Variant of “Quarry 10 parent”, revision 1" });
    // The parent is untouched.
    expect((await getKit(id)).version).toBe(3);
  });

  it("refuses a revision that is not there (404) and a missing name (422); nothing is created", async () => {
    const id = await newKit("Quarry 10 lone");
    const before = (await call<P>(kitsRoute.GET, "GET", `/api/workspaces/${ws}/kits?size=100`, { workspaceId: ws }, { cookie: owner.cookie })).json.total;
    const missing = await call<K>(variantsRoute.POST, "POST", `${kitPath(id)}/variants`, { workspaceId: ws, kitId: id }, { cookie: owner.cookie, body: { name: "x", revision: 5 } });
    expect(missing.status).toBe(404);
    const noName = await call<K>(variantsRoute.POST, "POST", `${kitPath(id)}/variants`, { workspaceId: ws, kitId: id }, { cookie: owner.cookie, body: {} });
    expect(noName.status).toBe(422);
    expect(noName.json.error.fields[0].path).toBe("name");
    const after = (await call<P>(kitsRoute.GET, "GET", `/api/workspaces/${ws}/kits?size=100`, { workspaceId: ws }, { cookie: owner.cookie })).json.total;
    expect(after).toBe(before);
  });

  it("a deleted origin leaves the variant standing, its origin cleared", async () => {
    const id = await newKit("Quarry 10 short-lived");
    const v = await call<K>(variantsRoute.POST, "POST", `${kitPath(id)}/variants`, { workspaceId: ws, kitId: id }, { cookie: owner.cookie, body: { name: "Quarry 10 survivor" } });
    await call<K>(kitRoute.DELETE, "DELETE", kitPath(id), { workspaceId: ws, kitId: id }, { cookie: owner.cookie });
    const kit = await getKit(v.json.kit.id);
    expect(kit).toMatchObject({ originKitId: null, originKitName: null, originRevision: 1 });
  });
});
