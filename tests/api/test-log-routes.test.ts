// The test log against the real database and the local object store: runs with the engine's prediction for
// the set-up as tested, numbered per kit; photos sniffed, capped, renamed without their path, stored under keys
// nobody can guess and read back only by members; every refusal leaves nothing stored.
import { beforeAll, describe, expect, it } from "vitest";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as revisionsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/revisions/route";
import * as runsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/test-runs/route";
import * as runRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]/route";
import * as photosRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]/photos/route";
import * as photoRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]/photos/[fileId]/route";
import * as fileRoute from "@/app/api/workspaces/[workspaceId]/files/[fileId]/route";
import * as shelfRoute from "@/app/api/workspaces/[workspaceId]/shelf/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { predictionLines, type TestRun } from "@/contracts/test-log";
import type { ShelfItem } from "@/contracts/shelf";
import { db } from "@/server/db/client";
import { attachments } from "@/server/db/schema";
import { eq } from "drizzle-orm";
import { call, signUp } from "../helpers/api";
import { download, filesOf, jpegBytes, PDF_BYTES, pngBytes, upload } from "../helpers/object-store";

type Person = Awaited<ReturnType<typeof signUp>>;
let owner: Person;
let other: Person;
let ws: string;
let otherWs: string;
let kit: string;
let otherKit: string;
let bar600: string;
let catalogue4140: string;
let joint: string;

const K = (w: string, k: string) => ({ workspaceId: w, kitId: k });
const R = (w: string, k: string, runId: string) => ({ ...K(w, k), runId });
const runsPath = (w: string, k: string) => `/api/workspaces/${w}/kits/${k}/test-runs`;
const photosPath = (w: string, k: string, r: string) => `${runsPath(w, k)}/${r}/photos`;

const setupOf = (torqueNm: number) => ({ motor: { kind: "torque", torqueNm }, gearRatios: [3, 2], lockDeg: 28, load: "1.6 kg car, 20 laps of the club loop" });
const runBody = (over: Record<string, unknown> = {}) => ({
  revision: 1,
  testedOn: "2026-03-14",
  part: "left front dogbone",
  materialId: bar600,
  setup: setupOf(0.5),
  outcome: "held",
  notes: "no marks at the neck",
  ...over,
});

async function logRun(over: Record<string, unknown> = {}, w = ws, k = kit, cookie = owner.cookie) {
  return call(runsRoute.POST, "POST", runsPath(w, k), K(w, k), { cookie, body: runBody(over) });
}

async function workspaceOf(p: Person): Promise<string> {
  return (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: p.cookie })).json.workspaces[0].id;
}

async function newKit(w: string, cookie: string, name: string): Promise<string> {
  const res = await call(kitsRoute.POST, "POST", `/api/workspaces/${w}/kits`, { workspaceId: w }, { cookie, body: { name, scale: "1:10", layout: TARNWICK_10_BASE } });
  expect(res.status).toBe(201);
  return res.json.kit.id;
}

const rowsOfRun = (runId: string) => db.select().from(attachments).where(eq(attachments.testRunId, runId));

beforeAll(async () => {
  owner = await signUp("Log Owner");
  other = await signUp("Log Other");
  ws = await workspaceOf(owner);
  otherWs = await workspaceOf(other);
  kit = await newKit(ws, owner.cookie, "Log kit");
  otherKit = await newKit(otherWs, other.cookie, "Other club's kit");
  const made = await call(shelfRoute.POST, "POST", `/api/workspaces/${ws}/shelf`, { workspaceId: ws }, {
    cookie: owner.cookie,
    body: { kind: "material", name: "Test bar 600", spec: { printed: false, tensileYieldMpa: 600, yieldSource: "test certificate (invented)", shearRule: "distortion-energy", derate: 1, derateSource: "" } },
  });
  expect(made.status).toBe(201);
  bar600 = made.json.item.id;
  const shelf = (await call(shelfRoute.GET, "GET", `/api/workspaces/${ws}/shelf`, { workspaceId: ws }, { cookie: owner.cookie })).json.items as ShelfItem[];
  catalogue4140 = shelf.find((i) => i.catalogueId === "aisi-4140-qt-540")!.id;
  joint = shelf.find((i) => i.kind === "joint")!.id;
});

describe("logging a run", () => {
  it("predicts the safety factor for the set-up as tested, by hand: T = T_m·N·η/n, τ = 16T/(πd³), S_sy = S_y/√3", async () => {
    const res = await logRun();
    expect(res.status).toBe(201);
    const run = res.json.run as TestRun;
    expect(run).toMatchObject({ number: 1, revision: 1, outcome: "held", materialName: "Test bar 600", part: "left front dogbone", photos: [] });
    // REFERENCES §6.2 [C] torque chain; Shigley 9th ed. §3-12 torsion and §5-5 distortion energy [F, via REFERENCES §6.1].
    const torqueNmm = (0.5 * 1000 * 3 * 2 * 0.9) / 2; // the layout's η 0.9 and 2 shafts sharing
    const tau = (16 * torqueNmm) / (Math.PI * 5 ** 3); // the layout's 5.0 mm solid neck
    const allowable = 600 / Math.sqrt(3);
    expect(torqueNmm).toBe(1350);
    const prediction = run.prediction!;
    expect(prediction.ok).toBe(true);
    if (!prediction.ok) return;
    expect(prediction.shaftTorqueNmm).toBeCloseTo(1350, 9);
    expect(prediction.shearStressMpa).toBeCloseTo(tau, 9);
    expect(prediction.safetyFactor).toBeCloseTo(allowable / tau, 9);
    expect(prediction.safetyFactor).toBeCloseTo(6.2979, 3);
  });

  it("with the layout's own motor, gearing and material the prediction is the revision's summary safety factor", async () => {
    const layoutSetup = { motor: TARNWICK_10_BASE.strength.motor, gearRatios: TARNWICK_10_BASE.strength.gearRatios, lockDeg: null, load: "" };
    const res = await logRun({ materialId: catalogue4140, setup: layoutSetup });
    expect(res.status).toBe(201);
    const revs = await call(revisionsRoute.GET, "GET", `/api/workspaces/${ws}/kits/${kit}/revisions`, K(ws, kit), { cookie: owner.cookie });
    const summarySf = revs.json.revisions.find((r: { number: number }) => r.number === 1).summary.safetyFactor;
    expect(res.json.run.prediction.safetyFactor).toBeCloseTo(summarySf, 9);
  });

  it("numbers runs per kit, also when two are logged at once", async () => {
    const before = (await call(runsRoute.GET, "GET", runsPath(ws, kit), K(ws, kit), { cookie: owner.cookie })).json.runs.length;
    const [a, b] = await Promise.all([logRun({ part: "concurrent A" }), logRun({ part: "concurrent B" })]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect([a.json.run.number, b.json.run.number].sort()).toEqual([before + 1, before + 2]);
    const list = (await call(runsRoute.GET, "GET", runsPath(ws, kit), K(ws, kit), { cookie: owner.cookie })).json.runs as TestRun[];
    expect(list.map((r) => r.number)).toEqual([...list.map((r) => r.number)].sort((x, y) => y - x));
    expect(new Set(list.map((r) => r.number)).size).toBe(list.length);
  });

  it("refuses bad input naming the field, and stores nothing", async () => {
    const count = (await call(runsRoute.GET, "GET", runsPath(ws, kit), K(ws, kit), { cookie: owner.cookie })).json.runs.length;
    const cases: [Record<string, unknown>, string][] = [
      [{ outcome: "broke" }, "failureLocation"],
      [{ outcome: "exploded" }, "outcome"],
      [{ testedOn: "2026-02-30" }, "testedOn"],
      [{ testedOn: "2999-01-01" }, "testedOn"],
      [{ part: "  " }, "part"],
      [{ setup: { ...setupOf(0.5), gearRatios: [] } }, "setup.gearRatios"],
      [{ setup: { ...setupOf(0.5), motor: { kind: "torque", torqueNm: -1 } } }, "setup.motor.torqueNm"],
      [{ revision: 99 }, "revision"],
      [{ materialId: joint }, "materialId"],
    ];
    for (const [over, path] of cases) {
      const res = await logRun(over);
      expect(res.status, JSON.stringify(over)).toBe(422);
      expect(res.json.error.fields.map((f: { path: string }) => f.path)).toContain(path);
    }
    expect((await call(runsRoute.GET, "GET", runsPath(ws, kit), K(ws, kit), { cookie: owner.cookie })).json.runs.length).toBe(count);
  });

  it("a run that broke says where; an edit re-predicts a new set-up and keeps optimistic locking", async () => {
    const made = (await logRun({ outcome: "broke", failureLocation: "neck, 2 mm from the ball", setup: setupOf(2) })).json.run as TestRun;
    const p = made.prediction!;
    const sfBefore = p.ok ? p.safetyFactor : NaN;
    const edited = await call(runRoute.PATCH, "PATCH", `${runsPath(ws, kit)}/${made.id}`, R(ws, kit, made.id), { cookie: owner.cookie, body: { version: 1, setup: setupOf(1) } });
    expect(edited.status).toBe(200);
    // Half the motor torque: twice the safety factor (n ∝ 1/T, REFERENCES §6.1).
    expect(edited.json.run.prediction.safetyFactor).toBeCloseTo(sfBefore * 2, 9);
    const stale = await call(runRoute.PATCH, "PATCH", `${runsPath(ws, kit)}/${made.id}`, R(ws, kit, made.id), { cookie: owner.cookie, body: { version: 1, notes: "late" } });
    expect(stale.status).toBe(409);
    const unbroken = await call(runRoute.PATCH, "PATCH", `${runsPath(ws, kit)}/${made.id}`, R(ws, kit, made.id), { cookie: owner.cookie, body: { version: 2, failureLocation: "" } });
    expect(unbroken.status).toBe(422);
  });

  it("the prediction lines read as the kit shows them", () => {
    const p = (sf: number) => ({ ok: true as const, safetyFactor: sf, shearStressMpa: 1, allowableShearMpa: 1, shaftTorqueNmm: 1, allowableSource: "" });
    expect(predictionLines([
      { number: 1, outcome: "held", prediction: p(1.4) },
      { number: 2, outcome: "held", prediction: p(1.4) },
      { number: 3, outcome: "broke", prediction: p(1.4) },
      { number: 4, outcome: "worn", prediction: p(2.1) },
    ])).toEqual(["predicted safety factor 2.10 — worn in run 4", "predicted safety factor 1.40 — held in runs 1 and 2, broke in run 3"]);
  });
});

describe("photos", () => {
  let runId: string;
  beforeAll(async () => {
    runId = (await logRun({ outcome: "worn", failureLocation: "pin flats" })).json.run.id;
  });

  it("stores a PNG under a random key, named without its path, and serves it back byte for byte", async () => {
    const bytes = await pngBytes(80, 60);
    const res = await upload(photosRoute.POST, "POST", photosPath(ws, kit, runId), R(ws, kit, runId), bytes, { cookie: owner.cookie, name: "../../etc/Neck after run 4.png" });
    expect(res.status).toBe(201);
    expect(res.json.photo).toMatchObject({ contentType: "image/png", byteSize: bytes.byteLength, fileName: "Neck after run 4.png" });
    const [row] = await db.select().from(attachments).where(eq(attachments.id, res.json.photo.id));
    expect(row!.objectKey).toMatch(new RegExp(`^files/${ws}/[A-Za-z0-9_-]{32}$`));
    expect(row!.objectKey).not.toMatch(/neck|png/i);
    expect(await filesOf(ws)).toContain(row!.objectKey);

    const got = await download(fileRoute.GET, res.json.photo.url, { workspaceId: ws, fileId: res.json.photo.id }, owner.cookie);
    expect(got.status).toBe(200);
    expect(got.bytes.equals(bytes)).toBe(true);
    expect(got.headers.get("content-type")).toBe("image/png");
    expect(got.headers.get("x-content-type-options")).toBe("nosniff");
    expect(got.headers.get("content-security-policy")).toContain("sandbox");
    const runs = (await call(runsRoute.GET, "GET", runsPath(ws, kit), K(ws, kit), { cookie: owner.cookie })).json.runs as TestRun[];
    expect(runs.find((r) => r.id === runId)!.photos.map((p) => p.id)).toEqual([res.json.photo.id]);
  });

  it("names a file by the type its bytes are, whatever it was called, and drops Windows path parts", async () => {
    const res = await upload(photosRoute.POST, "POST", photosPath(ws, kit, runId), R(ws, kit, runId), await jpegBytes(), { cookie: owner.cookie, name: "C:\\Users\\tomas\\track day.png" });
    expect(res.status).toBe(201);
    expect(res.json.photo).toMatchObject({ contentType: "image/jpeg", fileName: "track day.jpg" });
  });

  it("refuses a file of the wrong type (by its bytes, not its name), with nothing stored", async () => {
    const keys = await filesOf(ws);
    const rows = (await rowsOfRun(runId)).length;
    const pdf = await upload(photosRoute.POST, "POST", photosPath(ws, kit, runId), R(ws, kit, runId), PDF_BYTES, { cookie: owner.cookie, name: "photo.png" });
    expect(pdf.status).toBe(415);
    expect(pdf.json.error.code).toBe("unsupported_file_type");
    expect(pdf.json.error.message).toContain("application/pdf");
    const text = await upload(photosRoute.POST, "POST", photosPath(ws, kit, runId), R(ws, kit, runId), Buffer.from("just some words, not a picture"), { cookie: owner.cookie, name: "a.jpg" });
    expect(text.status).toBe(415);
    const asForm = await upload(photosRoute.POST, "POST", photosPath(ws, kit, runId), R(ws, kit, runId), await pngBytes(), { cookie: owner.cookie, contentType: "multipart/form-data; boundary=x" });
    expect(asForm.status).toBe(415);
    const empty = await upload(photosRoute.POST, "POST", photosPath(ws, kit, runId), R(ws, kit, runId), Buffer.alloc(0), { cookie: owner.cookie });
    expect(empty.status).toBe(422);
    expect(await filesOf(ws)).toEqual(keys);
    expect((await rowsOfRun(runId)).length).toBe(rows);
  });

  it("refuses an oversized file with 413, declared or streamed, with nothing stored", async () => {
    const keys = await filesOf(ws);
    const limit = 10_485_760; // KB_MAX_UPLOAD_BYTES's default
    const big = Buffer.concat([await pngBytes(), Buffer.alloc(limit)]);
    const declared = await upload(photosRoute.POST, "POST", photosPath(ws, kit, runId), R(ws, kit, runId), big, { cookie: owner.cookie, headers: { "content-length": String(big.byteLength) } });
    expect(declared.status).toBe(413);
    expect(declared.json.error.code).toBe("file_too_large");
    expect(declared.json.error.message).toContain("10 MB");
    const streamed = await upload(photosRoute.POST, "POST", photosPath(ws, kit, runId), R(ws, kit, runId), big, { cookie: owner.cookie, streamed: true });
    expect(streamed.status).toBe(413);
    expect(await filesOf(ws)).toEqual(keys);
  });

  it("refuses a photo aimed at another workspace's kit or run, with nothing stored there or here", async () => {
    const theirShelf = (await call(shelfRoute.GET, "GET", `/api/workspaces/${otherWs}/shelf`, { workspaceId: otherWs }, { cookie: other.cookie })).json.items as ShelfItem[];
    const theirMaterial = theirShelf.find((i) => i.kind === "material")!.id;
    const theirRun = (await logRun({ materialId: theirMaterial }, otherWs, otherKit, other.cookie)).json.run.id as string;
    const mine = await filesOf(ws);
    const theirs = await filesOf(otherWs);
    const bytes = await pngBytes();
    // Through my workspace, naming their kit and run: the kit is not in my workspace.
    const viaMine = await upload(photosRoute.POST, "POST", photosPath(ws, otherKit, theirRun), R(ws, otherKit, theirRun), bytes, { cookie: owner.cookie });
    expect(viaMine.status).toBe(404);
    // Through their workspace: I am not a member.
    const viaTheirs = await upload(photosRoute.POST, "POST", photosPath(otherWs, otherKit, theirRun), R(otherWs, otherKit, theirRun), bytes, { cookie: owner.cookie });
    expect(viaTheirs.status).toBe(403);
    // My kit with their run.
    const mixed = await upload(photosRoute.POST, "POST", photosPath(ws, kit, theirRun), R(ws, kit, theirRun), bytes, { cookie: owner.cookie });
    expect(mixed.status).toBe(404);
    expect(await filesOf(ws)).toEqual(mine);
    expect(await filesOf(otherWs)).toEqual(theirs);
    expect(await rowsOfRun(theirRun)).toEqual([]);
  });

  it("serves a file only to members of its workspace", async () => {
    const photo = (await upload(photosRoute.POST, "POST", photosPath(ws, kit, runId), R(ws, kit, runId), await pngBytes(), { cookie: owner.cookie })).json.photo;
    const anonymous = await download(fileRoute.GET, photo.url, { workspaceId: ws, fileId: photo.id });
    expect(anonymous.status).toBe(401);
    const outsider = await download(fileRoute.GET, photo.url, { workspaceId: ws, fileId: photo.id }, other.cookie);
    expect(outsider.status).toBe(403);
    // Asked for through the outsider's own workspace, the file is not there.
    const sideways = await download(fileRoute.GET, `/api/workspaces/${otherWs}/files/${photo.id}`, { workspaceId: otherWs, fileId: photo.id }, other.cookie);
    expect(sideways.status).toBe(404);
    expect([anonymous, outsider, sideways].every((r) => !r.headers.get("content-type")?.startsWith("image/"))).toBe(true);
  });

  it("removing a photo, a run or the kit removes the stored files too", async () => {
    const k = await newKit(ws, owner.cookie, "Kit to remove");
    const r1 = (await logRun({}, ws, k)).json.run.id as string;
    const r2 = (await logRun({}, ws, k)).json.run.id as string;
    const p1 = (await upload(photosRoute.POST, "POST", photosPath(ws, k, r1), R(ws, k, r1), await pngBytes(), { cookie: owner.cookie })).json.photo;
    const p2 = (await upload(photosRoute.POST, "POST", photosPath(ws, k, r1), R(ws, k, r1), await pngBytes(10, 10), { cookie: owner.cookie })).json.photo;
    const p3 = (await upload(photosRoute.POST, "POST", photosPath(ws, k, r2), R(ws, k, r2), await jpegBytes(), { cookie: owner.cookie })).json.photo;
    const keyOf = async (id: string) => (await db.select().from(attachments).where(eq(attachments.id, id)))[0]!.objectKey;
    const [k1, k2, k3] = [await keyOf(p1.id), await keyOf(p2.id), await keyOf(p3.id)];

    expect((await call(photoRoute.DELETE, "DELETE", `${photosPath(ws, k, r1)}/${p1.id}`, { ...R(ws, k, r1), fileId: p1.id }, { cookie: owner.cookie })).status).toBe(204);
    expect(await filesOf(ws)).not.toContain(k1);
    expect((await call(runRoute.DELETE, "DELETE", `${runsPath(ws, k)}/${r1}`, R(ws, k, r1), { cookie: owner.cookie })).status).toBe(204);
    expect(await filesOf(ws)).not.toContain(k2);
    expect(await filesOf(ws)).toContain(k3);
    expect((await call(kitRoute.DELETE, "DELETE", `/api/workspaces/${ws}/kits/${k}`, K(ws, k), { cookie: owner.cookie })).status).toBe(204);
    expect(await filesOf(ws)).not.toContain(k3);
    expect(await db.select().from(attachments).where(eq(attachments.kitId, k))).toEqual([]);
  });
});
