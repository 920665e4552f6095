// Every route of the design library (revisions, variants, the library table, compare, the shelf, the
// targets) against each kind of caller: anonymous, a member of another workspace, viewer, editor, admin,
// owner. Reads are open to every member; kit and shelf writes to editors and up; the workspace's targets to
// admins and owners.
import { beforeAll, describe, expect, it } from "vitest";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as facetsRoute from "@/app/api/workspaces/[workspaceId]/kits/facets/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as revisionsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/revisions/route";
import * as revisionRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/revisions/[revision]/route";
import * as restoreRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/revisions/[revision]/restore/route";
import * as variantsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/variants/route";
import * as compareRoute from "@/app/api/workspaces/[workspaceId]/compare/route";
import * as targetsRoute from "@/app/api/workspaces/[workspaceId]/targets/route";
import * as shelfRoute from "@/app/api/workspaces/[workspaceId]/shelf/route";
import * as shelfItemRoute from "@/app/api/workspaces/[workspaceId]/shelf/[itemId]/route";
import * as shelfKitsRoute from "@/app/api/workspaces/[workspaceId]/shelf/[itemId]/kits/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import { call, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";

type Who = "anonymous" | "outsider" | "viewer" | "editor" | "admin" | "owner";
const WHO: Who[] = ["anonymous", "outsider", "viewer", "editor", "admin", "owner"];

let ws: string;
let kitA: string;
let kitB: string;
let materialId: string;
const cookies: Partial<Record<Who, string>> = {};
let n = 0;

const W = () => ({ workspaceId: ws });
const K = (kitId: string) => ({ workspaceId: ws, kitId });
const base = () => `/api/workspaces/${ws}`;

async function kitVersion(kitId: string): Promise<number> {
  return (await call(kitRoute.GET, "GET", `${base()}/kits/${kitId}`, K(kitId), { cookie: cookies.owner })).json.kit.version;
}
async function targetsVersion(): Promise<number> {
  return (await call(targetsRoute.GET, "GET", `${base()}/targets`, W(), { cookie: cookies.owner })).json.version;
}
async function itemVersion(id: string): Promise<number> {
  return (await call(shelfItemRoute.GET, "GET", `${base()}/shelf/${id}`, { workspaceId: ws, itemId: id }, { cookie: cookies.owner })).json.item.version;
}
const material = (name: string) => ({ kind: "material", name, spec: { printed: false, tensileYieldMpa: 600, yieldSource: "mill certificate 2291 (invented for the test)", shearRule: "distortion-energy", derate: 1, derateSource: "" } });
async function freshItem(): Promise<string> {
  const res = await call(shelfRoute.POST, "POST", `${base()}/shelf`, W(), { cookie: cookies.owner, body: material(`Scratch bar ${++n}`) });
  expect(res.status).toBe(201);
  return res.json.item.id;
}

type Route = { name: string; run: (cookie: string | undefined) => Promise<{ status: number }>; reads?: true; admin?: true };

const ROUTES: Route[] = [
  { name: "GET the library", reads: true, run: (c) => call(kitsRoute.GET, "GET", `${base()}/kits?sort=safetyFactor&dir=asc`, W(), { cookie: c }) },
  { name: "GET the library's facets", reads: true, run: (c) => call(facetsRoute.GET, "GET", `${base()}/kits/facets`, W(), { cookie: c }) },
  { name: "GET a kit's revisions", reads: true, run: (c) => call(revisionsRoute.GET, "GET", `${base()}/kits/${kitA}/revisions`, K(kitA), { cookie: c }) },
  { name: "GET one revision", reads: true, run: (c) => call(revisionRoute.GET, "GET", `${base()}/kits/${kitA}/revisions/1`, { ...K(kitA), revision: "1" }, { cookie: c }) },
  { name: "GET a comparison", reads: true, run: (c) => call(compareRoute.GET, "GET", `${base()}/compare?items=${kitA},${kitB}@1`, W(), { cookie: c }) },
  { name: "GET the targets", reads: true, run: (c) => call(targetsRoute.GET, "GET", `${base()}/targets`, W(), { cookie: c }) },
  { name: "GET the shelf", reads: true, run: (c) => call(shelfRoute.GET, "GET", `${base()}/shelf`, W(), { cookie: c }) },
  { name: "GET a shelf item", reads: true, run: (c) => call(shelfItemRoute.GET, "GET", `${base()}/shelf/${materialId}`, { workspaceId: ws, itemId: materialId }, { cookie: c }) },
  { name: "GET a shelf item's kits", reads: true, run: (c) => call(shelfKitsRoute.GET, "GET", `${base()}/shelf/${materialId}/kits`, { workspaceId: ws, itemId: materialId }, { cookie: c }) },
  { name: "PUT a layout (a revision with a note)", run: async (c) => call(layoutRoute.PUT, "PUT", `${base()}/kits/${kitA}/layout`, K(kitA), { cookie: c, body: { version: await kitVersion(kitA), layout: ++n % 2 ? TARNWICK_10_THIN_NECK : TARNWICK_10_BASE, note: "matrix" } }) },
  { name: "PATCH a kit's tags, archive and targets", run: async (c) => call(kitRoute.PATCH, "PATCH", `${base()}/kits/${kitB}`, K(kitB), { cookie: c, body: { version: await kitVersion(kitB), tags: ["matrix"], archived: false, targets: { minLockDeg: 28 } } }) },
  { name: "POST restore a revision", run: async (c) => call(restoreRoute.POST, "POST", `${base()}/kits/${kitA}/revisions/1/restore`, { ...K(kitA), revision: "1" }, { cookie: c, body: { version: await kitVersion(kitA) } }) },
  { name: "POST a variant", run: (c) => call(variantsRoute.POST, "POST", `${base()}/kits/${kitA}/variants`, K(kitA), { cookie: c, body: { name: `Matrix variant ${++n}`, revision: 1 } }) },
  { name: "POST a shelf item", run: (c) => call(shelfRoute.POST, "POST", `${base()}/shelf`, W(), { cookie: c, body: material(`Matrix bar ${++n}`) }) },
  { name: "PATCH a shelf item", run: async (c) => call(shelfItemRoute.PATCH, "PATCH", `${base()}/shelf/${materialId}`, { workspaceId: ws, itemId: materialId }, { cookie: c, body: { version: await itemVersion(materialId), name: `Matrix steel ${++n}` } }) },
  { name: "DELETE a shelf item", run: async (c) => { const id = await freshItem(); return call(shelfItemRoute.DELETE, "DELETE", `${base()}/shelf/${id}`, { workspaceId: ws, itemId: id }, { cookie: c }); } },
  { name: "PUT the targets", admin: true, run: async (c) => call(targetsRoute.PUT, "PUT", `${base()}/targets`, W(), { cookie: c, body: { version: await targetsVersion(), targets: { minLockDeg: 29 + (++n % 3), maxJointAngleDeg: 32, minSafetyFactor: 2, ackermannMinPct: 0, ackermannMaxPct: 100, minNeckClearanceMm: 0.2 } } }) },
];

function expected(who: Who, route: Route): number[] {
  if (who === "anonymous") return [401];
  if (who === "outsider") return [403];
  if (route.reads) return [200];
  const allowed = route.admin ? who === "admin" || who === "owner" : who !== "viewer";
  return allowed ? [200, 201, 204] : [403];
}

beforeAll(async () => {
  const people = {} as Record<Exclude<Who, "anonymous">, Awaited<ReturnType<typeof signUp>>>;
  for (const who of ["owner", "admin", "editor", "viewer", "outsider"] as const) people[who] = await signUp(`Matrix ${who}`);
  for (const who of ["owner", "admin", "editor", "viewer", "outsider"] as const) cookies[who] = people[who].cookie;
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: cookies.owner })).json.workspaces[0].id;
  for (const who of ["admin", "editor", "viewer"] as const) await addMemberByInvitation(people.owner, ws, people[who], who);
  const a = await call(kitsRoute.POST, "POST", `${base()}/kits`, W(), { cookie: cookies.owner, body: { name: "Matrix kit A", scale: "1:10", layout: TARNWICK_10_BASE } });
  const b = await call(kitsRoute.POST, "POST", `${base()}/kits`, W(), { cookie: cookies.owner, body: { name: "Matrix kit B", scale: "1:10", layout: TARNWICK_10_THIN_NECK } });
  kitA = a.json.kit.id;
  kitB = b.json.kit.id;
  materialId = await freshItem();
});

describe.each(WHO)("as %s", (who) => {
  it.each(ROUTES.map((r) => [r.name, r] as const))("%s", async (_name, route) => {
    const res = await route.run(cookies[who as Exclude<Who, "anonymous">]);
    expect(expected(who, route), `${who}: ${route.name} answered ${res.status}`).toContain(res.status);
  });
});

describe("refusals say why", () => {
  it("an editor may not change the workspace's targets, and is told so", async () => {
    const res = await call(targetsRoute.PUT, "PUT", `${base()}/targets`, W(), { cookie: cookies.editor, body: { version: 1, targets: {} } });
    expect(res.status).toBe(403);
    expect(res.json.error.message).toBe("An editor of this workspace may not update the workspace's targets.");
  });

  it("a viewer may not change the shelf", async () => {
    const res = await call(shelfRoute.POST, "POST", `${base()}/shelf`, W(), { cookie: cookies.viewer, body: material("Viewer bar") });
    expect(res.status).toBe(403);
    expect(res.json.error.message).toBe("A viewer of this workspace may not create the shelf.");
  });

  it("another workspace's member gets the same answer for a kit that exists and one that does not", async () => {
    const real = await call(revisionsRoute.GET, "GET", `${base()}/kits/${kitA}/revisions`, K(kitA), { cookie: cookies.outsider });
    const fake = "00000000-0000-4000-8000-000000000000";
    const made = await call(revisionsRoute.GET, "GET", `${base()}/kits/${fake}/revisions`, K(fake), { cookie: cookies.outsider });
    expect(real.status).toBe(403);
    expect(real.json).toEqual(made.json);
  });
});
