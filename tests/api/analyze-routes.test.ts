import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import * as analyzeRoute from "@/app/api/analyze/route";
import * as layoutSchemaRoute from "@/app/api/layout-schema/route";
import * as kitAnalyzeRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/analyze/route";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { DEMO_LAYOUTS, TARNWICK_10_BASE, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import { isCitationKey } from "@/engine/methods/citations";
import schema1 from "../contracts/fixtures/schema-1-documents.json";
import { call, signUp } from "../helpers/api";
import { OUTSIDE_REFERENCE } from "../helpers/outside-reference";

let designer: Awaited<ReturnType<typeof signUp>>;
let outsider: Awaited<ReturnType<typeof signUp>>;
let ws: string;

const constants = (o: object) => Object.fromEntries(Object.entries(o).map(([k, v]) => [k, fc.constant(v)]));
const analyze = (body: unknown, cookie = designer.cookie) => call(analyzeRoute.POST, "POST", "/api/analyze", {}, { cookie, body });

beforeAll(async () => {
  designer = await signUp("Noor Falk");
  outsider = await signUp("Bram Teller");
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: designer.cookie })).json.workspaces[0].id;
});

describe("POST /api/analyze", () => {
  it("needs a session", async () => {
    const res = await call(analyzeRoute.POST, "POST", "/api/analyze", {}, { body: { layout: TARNWICK_10_BASE } });
    expect(res.status).toBe(401);
  });

  it("answers the demo kit with steer lock and what limits it, joint angle, camber gain, roll centre, Ackermann and safety factor", async () => {
    const res = await analyze({ layout: TARNWICK_10_BASE });
    expect(res.status).toBe(200);
    const a = res.json.analysis;
    expect(a.steerLock.worst.innerDeg).toBeGreaterThan(10);
    expect(["neck-contact", "slot-limit", "rated-angle", "toggle", "input-travel"]).toContain(a.steerLock.worst.limitedBy);
    expect(a.drive.maxJointAngleWithinLockDeg).toBeLessThanOrEqual(a.drive.jointLimitDeg + 1e-6);
    const statik = a.atStatic;
    expect(statik.travelMm).toBe(0);
    expect(Number.isFinite(statik.camberGainDegPerMm)).toBe(true);
    expect(Number.isFinite(statik.rollCentreHeightMm)).toBe(true);
    expect(Number.isFinite(a.ackermann.atLockPct)).toBe(true);
    expect(a.strength.safetyFactor).toBeGreaterThan(0);
    expect(JSON.stringify(a)).not.toMatch(/NaN|Infinity/);
  });

  it("a thinner neck raises steer lock or leaves it, and lowers the safety factor", async () => {
    const base = (await analyze({ layout: TARNWICK_10_BASE })).json.analysis;
    const thin = (await analyze({ layout: TARNWICK_10_THIN_NECK })).json.analysis;
    expect(thin.steerLock.worst.innerDeg).toBeGreaterThanOrEqual(base.steerLock.worst.innerDeg - 1e-9);
    expect(thin.strength.safetyFactor).toBeLessThan(base.strength.safetyFactor);
    // Solid neck in torsion: τ ∝ 1/d³, so n scales with (4/5)³ (Shigley 9th ed. §3-12, τ = 16T/(πd³)).
    expect(thin.strength.safetyFactor / base.strength.safetyFactor).toBeCloseTo((4 / 5) ** 3, 6);
  });

  it("honours the grid and refuses one over the budget, naming the field", async () => {
    const small = await analyze({ layout: TARNWICK_10_BASE, grid: { travelSteps: 5, steerSteps: 7 } });
    expect(small.status).toBe(200);
    expect(small.json.analysis.grid).toEqual({ travelSteps: 5, steerSteps: 7 });
    expect(small.json.analysis.travel).toHaveLength(5);
    const big = await analyze({ layout: TARNWICK_10_BASE, grid: { travelSteps: 81, steerSteps: 10_000 } });
    expect(big.status).toBe(422);
    expect(big.json.error.fields[0].path).toBe("grid.steerSteps");
  });

  it("bad layouts get 422 with the field path; impossible geometry names the part", async () => {
    const missing = await analyze({ layout: { ...TARNWICK_10_BASE, drive: undefined } });
    expect(missing.status).toBe(422);
    expect(missing.json.error.fields[0].path).toBe("layout.drive");
    const wide = await analyze({ layout: { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: 9 } } });
    expect(wide.status).toBe(422);
    expect(wide.json.error.message).toMatch(/neck/i);
  });

  it("no JSON body of any shape causes a 5xx (random bodies)", async () => {
    const jsonValue = fc.jsonValue({ maxDepth: 4 });
    const nearLayout = fc.record({
      layout: fc.record({
        schema: fc.oneof(fc.constant(2), fc.constant(1), fc.constant(0), jsonValue),
        frontView: fc.oneof(fc.constant(TARNWICK_10_BASE.frontView), jsonValue),
        sideView: fc.oneof(fc.constant(TARNWICK_10_BASE.sideView), jsonValue),
        topView: fc.oneof(fc.constant(TARNWICK_10_BASE.topView), jsonValue),
        drive: fc.oneof(fc.record({ ...constants(TARNWICK_10_BASE.drive), neckDiameterMm: fc.double({ min: -10, max: 20, noNaN: false }) }), jsonValue),
        strength: fc.oneof(fc.constant(TARNWICK_10_BASE.strength), jsonValue),
      }, { requiredKeys: [] }),
      grid: fc.oneof(fc.constant(undefined), fc.record({ travelSteps: fc.integer({ min: -5, max: 300 }), steerSteps: fc.integer({ min: -5, max: 300 }) }), jsonValue),
    }, { requiredKeys: ["layout"] });
    await fc.assert(
      fc.asyncProperty(fc.oneof(jsonValue, nearLayout), async (body) => {
        const res = await analyze(body);
        expect(res.status).toBeGreaterThanOrEqual(200);
        expect(res.status).toBeLessThan(500);
        if (res.status === 200) expect(JSON.stringify(res.json)).not.toMatch(/NaN|Infinity/);
      }),
      { numRuns: 150 },
    );
  });
});

/** Every string anywhere in a JSON answer. */
function strings(v: unknown, out: string[] = []): string[] {
  if (typeof v === "string") out.push(v);
  else if (Array.isArray(v)) v.forEach((x) => strings(x, out));
  else if (v !== null && typeof v === "object") Object.values(v).forEach((x) => strings(x, out));
  return out;
}

describe("the answers cite the methods page, nothing outside the product", () => {
  it.each(DEMO_LAYOUTS.map((d) => [d.key, d.layout] as const))("%s: no reference to a file outside the product; every source named is a citation key", async (_, layout) => {
    const res = await analyze({ layout, grid: { travelSteps: 5, steerSteps: 7 } });
    expect(res.status).toBe(200);
    const text = JSON.stringify(res.json);
    expect(text).not.toMatch(OUTSIDE_REFERENCE);
    for (const k of res.json.analysis.strength.allowableCitations as string[]) expect(isCitationKey(k), k).toBe(true);
    for (const s of strings(res.json)) expect(s).not.toMatch(/\bREFERENCES\b/);
  });

  it("a schema 1 document (rackEnd, ±10 mm rack) analyses, and the answer says its rack runs past the tie-rod toggle", async () => {
    const doc = (schema1 as unknown as { base: { document: unknown } }).base.document;
    const res = await analyze({ layout: doc, grid: { travelSteps: 5, steerSteps: 9 } });
    expect(res.status).toBe(200);
    const stop = res.json.analysis.steeringStop;
    expect(stop.status).toBe("needed");
    expect(stop.toggle).not.toBeNull();
    expect(Math.abs(stop.toggle.steerInput)).toBeLessThan(10);
  });
});

describe("POST /api/workspaces/{w}/kits/{k}/analyze", () => {
  it("analyses the stored layout for a member, refuses others", async () => {
    const created = await call(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: designer.cookie, body: { name: "Thin", scale: "1:10", layout: TARNWICK_10_THIN_NECK } });
    const kitId = created.json.kit.id;
    const path = `/api/workspaces/${ws}/kits/${kitId}/analyze`;
    const mine = await call(kitAnalyzeRoute.POST, "POST", path, { workspaceId: ws, kitId }, { cookie: designer.cookie, body: { grid: { travelSteps: 3, steerSteps: 5 } } });
    expect(mine.status).toBe(200);
    expect(mine.json.version).toBe(1);
    expect(mine.json.analysis.grid).toEqual({ travelSteps: 3, steerSteps: 5 });
    const noBody = await call(kitAnalyzeRoute.POST, "POST", path, { workspaceId: ws, kitId }, { cookie: designer.cookie });
    expect(noBody.status).toBe(200);
    const theirs = await call(kitAnalyzeRoute.POST, "POST", path, { workspaceId: ws, kitId }, { cookie: outsider.cookie });
    expect(theirs.status).toBe(403);
  });
});

describe("GET /api/layout-schema", () => {
  it("serves the JSON Schema of the layout document", async () => {
    const res = await call(layoutSchemaRoute.GET, "GET", "/api/layout-schema", {});
    expect(res.status).toBe(200);
    expect(res.json.$schema).toMatch(/json-schema\.org/);
    expect(Object.keys(res.json.properties)).toEqual(expect.arrayContaining(["schema", "frontView", "sideView", "topView", "drive", "strength"]));
    expect(res.json.properties.drive.properties.neckDiameterMm.type).toBe("number");
  });
});
