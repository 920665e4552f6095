// Every route of the test log, the files, calibration and underlays against each kind of caller: anonymous, a
// member of another workspace, viewer, editor, admin, owner. Reads are open to every member; writes to editors
// and up (applying a calibration is a shelf edit). A refused upload stores nothing.
import { beforeAll, describe, expect, it } from "vitest";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as runsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/test-runs/route";
import * as runRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]/route";
import * as photosRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]/photos/route";
import * as photoRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]/photos/[fileId]/route";
import * as fileRoute from "@/app/api/workspaces/[workspaceId]/files/[fileId]/route";
import * as calibrationRoute from "@/app/api/workspaces/[workspaceId]/calibration/route";
import * as applyRoute from "@/app/api/workspaces/[workspaceId]/calibration/[materialId]/route";
import * as underlaysRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/underlays/route";
import * as underlayRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/underlays/[view]/route";
import * as shelfRoute from "@/app/api/workspaces/[workspaceId]/shelf/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { call, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";
import { download, filesOf, pngBytes, upload } from "../helpers/object-store";

type Who = "anonymous" | "outsider" | "viewer" | "editor" | "admin" | "owner";
const WHO: Who[] = ["anonymous", "outsider", "viewer", "editor", "admin", "owner"];

let ws: string;
let kit: string;
let material: string;
let runId: string;
let photoId: string;
const cookies: Partial<Record<Who, string>> = {};
let n = 0;

const base = () => `/api/workspaces/${ws}`;
const K = () => ({ workspaceId: ws, kitId: kit });
const runBody = (materialId = material, outcome = "held") => ({
  revision: 1,
  testedOn: "2026-05-01",
  part: "dogbone",
  materialId,
  setup: { motor: { kind: "torque", torqueNm: outcome === "held" ? 0.02 : 0.2 }, gearRatios: [3, 2], lockDeg: null, load: "" },
  outcome,
  ...(outcome === "broke" ? { failureLocation: "neck" } : {}),
});

async function freshRun(): Promise<string> {
  const res = await call(runsRoute.POST, "POST", `${base()}/kits/${kit}/test-runs`, K(), { cookie: cookies.owner, body: runBody() });
  expect(res.status).toBe(201);
  return res.json.run.id;
}
async function freshPhoto(run: string): Promise<string> {
  const res = await upload(photosRoute.POST, "POST", `${base()}/kits/${kit}/test-runs/${run}/photos`, { ...K(), runId: run }, await pngBytes(), { cookie: cookies.owner });
  expect(res.status).toBe(201);
  return res.json.photo.id;
}
async function underlayVersion(): Promise<number> {
  const list = await call(underlaysRoute.GET, "GET", `${base()}/kits/${kit}/underlays`, K(), { cookie: cookies.owner });
  return list.json.underlays.find((u: { view: string }) => u.view === "top").version;
}
/** A material whose two runs (held, broke) calibrate it, used by no kit: applying rewrites nothing. */
async function calibratedMaterial(): Promise<{ id: string; derate: number }> {
  const made = await call(shelfRoute.POST, "POST", `${base()}/shelf`, { workspaceId: ws }, {
    cookie: cookies.owner,
    body: { kind: "material", name: `Matrix print ${++n}`, spec: { printed: true, tensileYieldMpa: 50, yieldSource: "coupons (invented)", shearRule: "distortion-energy", derate: 0.5, derateSource: "settings (invented)" } },
  });
  const id = made.json.item.id as string;
  for (const o of ["held", "broke"]) await call(runsRoute.POST, "POST", `${base()}/kits/${kit}/test-runs`, K(), { cookie: cookies.owner, body: runBody(id, o) });
  const cal = await call(calibrationRoute.GET, "GET", `${base()}/calibration`, { workspaceId: ws }, { cookie: cookies.owner });
  return { id, derate: cal.json.materials.find((m: { material: { id: string } }) => m.material.id === id).proposal.derateAfter };
}

type Route = { name: string; run: (cookie: string | undefined) => Promise<{ status: number }>; reads?: true; upload?: true };

const ROUTES: Route[] = [
  { name: "GET a kit's test runs", reads: true, run: (c) => call(runsRoute.GET, "GET", `${base()}/kits/${kit}/test-runs`, K(), { cookie: c }) },
  { name: "GET a photo", reads: true, run: (c) => download(fileRoute.GET, `${base()}/files/${photoId}`, { workspaceId: ws, fileId: photoId }, c) },
  { name: "GET the calibration", reads: true, run: (c) => call(calibrationRoute.GET, "GET", `${base()}/calibration`, { workspaceId: ws }, { cookie: c }) },
  { name: "GET a kit's underlays", reads: true, run: (c) => call(underlaysRoute.GET, "GET", `${base()}/kits/${kit}/underlays`, K(), { cookie: c }) },
  { name: "POST a test run", run: (c) => call(runsRoute.POST, "POST", `${base()}/kits/${kit}/test-runs`, K(), { cookie: c, body: runBody() }) },
  { name: "PATCH a test run", run: async (c) => call(runRoute.PATCH, "PATCH", `${base()}/kits/${kit}/test-runs/${runId}`, { ...K(), runId }, { cookie: c, body: { version: (await call(runsRoute.GET, "GET", `${base()}/kits/${kit}/test-runs`, K(), { cookie: cookies.owner })).json.runs.find((r: { id: string }) => r.id === runId).version, notes: `matrix ${++n}` } }) },
  { name: "DELETE a test run", run: async (c) => { const r = await freshRun(); return call(runRoute.DELETE, "DELETE", `${base()}/kits/${kit}/test-runs/${r}`, { ...K(), runId: r }, { cookie: c }); } },
  { name: "POST a photo", upload: true, run: async (c) => upload(photosRoute.POST, "POST", `${base()}/kits/${kit}/test-runs/${runId}/photos`, { ...K(), runId }, await pngBytes(8, 8), { cookie: c }) },
  { name: "DELETE a photo", run: async (c) => { const p = await freshPhoto(runId); return call(photoRoute.DELETE, "DELETE", `${base()}/kits/${kit}/test-runs/${runId}/photos/${p}`, { ...K(), runId, fileId: p }, { cookie: c }); } },
  { name: "POST apply a calibration", run: async (c) => { const m = await calibratedMaterial(); return call(applyRoute.POST, "POST", `${base()}/calibration/${m.id}`, { workspaceId: ws, materialId: m.id }, { cookie: c, body: { version: 1, runs: 2, derate: m.derate } }); } },
  { name: "PUT an underlay", upload: true, run: async (c) => upload(underlayRoute.PUT, "PUT", `${base()}/kits/${kit}/underlays/top`, { ...K(), view: "top" }, await pngBytes(20, 20), { cookie: c }) },
  { name: "PATCH an underlay", run: async (c) => call(underlayRoute.PATCH, "PATCH", `${base()}/kits/${kit}/underlays/top`, { ...K(), view: "top" }, { cookie: c, body: { version: await underlayVersion(), opacity: 0.3 + (++n % 5) / 10 } }) },
  {
    name: "DELETE an underlay",
    run: async (c) => {
      await upload(underlayRoute.PUT, "PUT", `${base()}/kits/${kit}/underlays/front`, { ...K(), view: "front" }, await pngBytes(12, 12), { cookie: cookies.owner });
      return call(underlayRoute.DELETE, "DELETE", `${base()}/kits/${kit}/underlays/front`, { ...K(), view: "front" }, { cookie: c });
    },
  },
];

function expected(who: Who, route: Route): number[] {
  if (who === "anonymous") return [401];
  if (who === "outsider") return [403];
  if (route.reads) return [200];
  return who === "viewer" ? [403] : [200, 201, 204];
}

beforeAll(async () => {
  const people = {} as Record<Exclude<Who, "anonymous">, Awaited<ReturnType<typeof signUp>>>;
  for (const who of ["owner", "admin", "editor", "viewer", "outsider"] as const) people[who] = await signUp(`Log matrix ${who}`);
  for (const who of ["owner", "admin", "editor", "viewer", "outsider"] as const) cookies[who] = people[who].cookie;
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: cookies.owner })).json.workspaces[0].id;
  for (const who of ["admin", "editor", "viewer"] as const) await addMemberByInvitation(people.owner, ws, people[who], who);
  kit = (await call(kitsRoute.POST, "POST", `${base()}/kits`, { workspaceId: ws }, { cookie: cookies.owner, body: { name: "Matrix log kit", scale: "1:10", layout: TARNWICK_10_BASE } })).json.kit.id;
  const shelf = await call(shelfRoute.GET, "GET", `${base()}/shelf`, { workspaceId: ws }, { cookie: cookies.owner });
  material = shelf.json.items.find((i: { kind: string }) => i.kind === "material").id;
  runId = await freshRun();
  photoId = await freshPhoto(runId);
  await upload(underlayRoute.PUT, "PUT", `${base()}/kits/${kit}/underlays/top`, { ...K(), view: "top" }, await pngBytes(16, 16), { cookie: cookies.owner });
});

describe.each(WHO)("as %s", (who) => {
  it.each(ROUTES.map((r) => [r.name, r] as const))("%s", async (_name, route) => {
    const before = route.upload ? await filesOf(ws) : [];
    const res = await route.run(cookies[who as Exclude<Who, "anonymous">]);
    expect(expected(who, route), `${who}: ${route.name} answered ${res.status}`).toContain(res.status);
    // A refused upload leaves the store as it was.
    if (route.upload && res.status >= 400) expect(await filesOf(ws)).toEqual(before);
  });
});
