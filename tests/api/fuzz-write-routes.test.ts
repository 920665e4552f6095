// Issue 7: 3,750 random and malformed bodies, media types and path ids on the write routes, as a signed-in owner,
// against the real database: never a 5xx. (fast-check generates the cases; a failure prints the shrunk one.)
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import * as analyzeRoute from "@/app/api/analyze/route";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import * as memberRoute from "@/app/api/workspaces/[workspaceId]/members/[memberId]/route";
import * as activateRoute from "@/app/api/workspaces/[workspaceId]/activate/route";
import * as kitAnalyzeRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/analyze/route";
import * as preferencesRoute from "@/app/api/me/preferences/route";
import * as membersRoute from "@/app/api/workspaces/[workspaceId]/members/route";
import * as invitationRoute from "@/app/api/workspaces/[workspaceId]/invitations/[invitationId]/route";
import * as invitationsRoute from "@/app/api/workspaces/[workspaceId]/invitations/route";
import * as acceptRoute from "@/app/api/me/invitations/[invitationId]/accept/route";
import * as declineRoute from "@/app/api/me/invitations/[invitationId]/decline/route";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { call, signUp } from "../helpers/api";

let cookie: string;
let ws: string;
let kitId: string;
let invitationId: string;

beforeAll(async () => {
  cookie = (await signUp("Maren Fuzz")).cookie;
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie })).json.workspaces[0].id;
  kitId = (await call(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie, body: { name: "Fuzz kit", scale: "1:10" } })).json.kit.id;
  await call(membersRoute.POST, "POST", "/x", { workspaceId: ws }, { cookie, body: { email: "fuzz-invitee@fuzz.example", role: "editor" } });
  invitationId = (await call(invitationsRoute.GET, "GET", "/x", { workspaceId: ws }, { cookie })).json.invitations[0].id;
});

const id = () => fc.oneof(fc.constant("REAL"), fc.string(), fc.uuid(), fc.constant("\u0000"), fc.constant("x".repeat(300)));
const body = fc.oneof(
  fc.json(),
  fc.record({ email: fc.oneof(fc.emailAddress(), fc.string()), role: fc.oneof(fc.constantFrom("viewer", "editor", "admin", "owner"), fc.string()) }, { requiredKeys: [] }).map((o) => JSON.stringify(o)),
  fc.string(),
  fc.record({ version: fc.oneof(fc.integer(), fc.double(), fc.string()), name: fc.oneof(fc.string(), fc.integer()), layout: fc.oneof(fc.constant(TARNWICK_10_BASE), fc.jsonValue()) }, { requiredKeys: [] }).map((o) => JSON.stringify(o)),
);
const contentType = fc.constantFrom("application/json", "application/json; charset=utf-8", "text/plain;charset=json", "", "application/x-www-form-urlencoded", "application/json; a=\u0001");

type Route = { name: string; send: (path: string, raw: string, type: string) => Promise<{ status: number }> };
const pick = (v: string, real: string) => (v === "REAL" ? real : v);
const routes: Route[] = [
  { name: "kits POST", send: (w, raw, type) => call(kitsRoute.POST, "POST", "/x", { workspaceId: pick(w, ws) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "kit PATCH", send: (k, raw, type) => call(kitRoute.PATCH, "PATCH", "/x", { workspaceId: ws, kitId: pick(k, kitId) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "layout PUT", send: (k, raw, type) => call(layoutRoute.PUT, "PUT", "/x", { workspaceId: ws, kitId: pick(k, kitId) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "workspaces POST", send: (_w, raw, type) => call(workspacesRoute.POST, "POST", "/x", {}, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "member PATCH", send: (m, raw, type) => call(memberRoute.PATCH, "PATCH", "/x", { workspaceId: ws, memberId: m }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "member DELETE", send: (m, raw, type) => call(memberRoute.DELETE, "DELETE", "/x", { workspaceId: ws, memberId: m }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "activate POST", send: (w, raw, type) => call(activateRoute.POST, "POST", "/x", { workspaceId: pick(w, ws) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "preferences PUT", send: (_w, raw, type) => call(preferencesRoute.PUT, "PUT", "/x", {}, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "kit analysis POST", send: (k, raw, type) => call(kitAnalyzeRoute.POST, "POST", "/x", { workspaceId: ws, kitId: pick(k, kitId) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "analysis POST", send: (_w, raw, type) => call(analyzeRoute.POST, "POST", "/x", {}, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "invite POST", send: (w, raw, type) => call(membersRoute.POST, "POST", "/x", { workspaceId: pick(w, ws) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "invitation accept POST", send: (i, raw, type) => call(acceptRoute.POST, "POST", "/x", { invitationId: pick(i, invitationId) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "invitation decline POST", send: (i, raw, type) => call(declineRoute.POST, "POST", "/x", { invitationId: pick(i, invitationId) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  { name: "invitation DELETE", send: (i, raw, type) => call(invitationRoute.DELETE, "DELETE", "/x", { workspaceId: ws, invitationId: pick(i, invitationId) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
  // Last: a real kit id here deletes the kit the routes above write to.
  { name: "kit DELETE", send: (k, raw, type) => call(kitRoute.DELETE, "DELETE", "/x", { workspaceId: ws, kitId: pick(k, kitId) }, { cookie, rawBody: raw, headers: type ? { "content-type": type } : {} }) },
];

describe("fuzzed writes never answer 5xx", () => {
  it.each(routes.map((r) => [r.name, r] as const))("%s (250 cases)", async (_name, route) => {
    await fc.assert(
      fc.asyncProperty(id(), body, contentType, async (pathId, raw, type) => {
        const res = await route.send(pathId, raw, type);
        expect(res.status).toBeLessThan(500);
      }),
      { numRuns: 250 },
    );
  }, 60_000);
});
