// Calibration per material against the real database: every logged run's safety factor with the material's
// figure of today against its outcome, the bounds, the derate that puts the line between them, and applying it
// to the shelf material as a new figure "calibrated from N test runs" (a shelf edit: the kits it changes are
// confirmed first).
import { beforeAll, describe, expect, it } from "vitest";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as revisionsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/revisions/route";
import * as runsRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/test-runs/route";
import * as calibrationRoute from "@/app/api/workspaces/[workspaceId]/calibration/route";
import * as applyRoute from "@/app/api/workspaces/[workspaceId]/calibration/[materialId]/route";
import * as shelfRoute from "@/app/api/workspaces/[workspaceId]/shelf/route";
import * as shelfItemRoute from "@/app/api/workspaces/[workspaceId]/shelf/[itemId]/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import type { MaterialCalibration } from "@/contracts/calibration";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { applyShelfItem, type MaterialSpec, type ShelfItem } from "@/contracts/shelf";
import { call, signUp } from "../helpers/api";

let cookie: string;
let ws: string;
const W = () => ({ workspaceId: ws });

async function material(name: string, spec: Partial<MaterialSpec>): Promise<ShelfItem> {
  const full = { printed: true, tensileYieldMpa: 60, yieldSource: "across-layer coupons (invented for the test)", shearRule: "distortion-energy", derate: 0.6, derateSource: "club print settings (invented)", ...spec };
  const res = await call(shelfRoute.POST, "POST", `/api/workspaces/${ws}/shelf`, W(), { cookie, body: { kind: "material", name, spec: full } });
  expect(res.status).toBe(201);
  return res.json.item;
}

async function kitWith(item: ShelfItem, name: string): Promise<string> {
  const res = await call(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, W(), { cookie, body: { name, scale: "1:10", layout: applyShelfItem(TARNWICK_10_BASE, item) } });
  expect(res.status).toBe(201);
  return res.json.kit.id;
}

/** Logs a run with a torque motor: on the 5.0 mm neck, T = 2700·T_m N·mm and τ = 110.008·T_m MPa. */
async function run(kitId: string, materialId: string, torqueNm: number, outcome: "held" | "worn" | "broke") {
  const res = await call(runsRoute.POST, "POST", `/api/workspaces/${ws}/kits/${kitId}/test-runs`, { workspaceId: ws, kitId }, {
    cookie,
    body: { revision: 1, testedOn: "2026-04-02", part: "dogbone", materialId, setup: { motor: { kind: "torque", torqueNm }, gearRatios: [3, 2], lockDeg: null, load: "bench rig" }, outcome, ...(outcome === "broke" ? { failureLocation: "neck" } : {}) },
  });
  expect(res.status).toBe(201);
}

async function calibrationOf(materialId: string): Promise<MaterialCalibration> {
  const res = await call(calibrationRoute.GET, "GET", `/api/workspaces/${ws}/calibration`, W(), { cookie });
  expect(res.status).toBe(200);
  return res.json.materials.find((m: MaterialCalibration) => m.material.id === materialId);
}

const summarySf = async (kitId: string, n: number) =>
  (await call(revisionsRoute.GET, "GET", `/api/workspaces/${ws}/kits/${kitId}/revisions`, { workspaceId: ws, kitId }, { cookie })).json.revisions.find((r: { number: number }) => r.number === n).summary.safetyFactor as number;

beforeAll(async () => {
  const owner = await signUp("Calibration Owner");
  cookie = owner.cookie;
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie })).json.workspaces[0].id;
});

describe("a printed material's runs", () => {
  let item: ShelfItem;
  let kitId: string;
  beforeAll(async () => {
    item = await material("Test PA12 print", {});
    kitId = await kitWith(item, "Printed test kit");
    // Allowable 60·0.6/√3 = 20.7846 MPa (Shigley 9th ed. §5-5 [F, via REFERENCES §6.1]); SF = 0.188940/T_m.
    for (const [t, o] of [[0.1, "held"], [0.12, "held"], [0.15, "worn"], [0.2, "broke"], [0.25, "broke"]] as const) await run(kitId, item.id, t, o);
  });

  it("gives each run's safety factor, the lowest that held, the highest that broke and the factor between them", async () => {
    const c = await calibrationOf(item.id);
    expect(c.allowableShearMpa).toBeCloseTo((60 * 0.6) / Math.sqrt(3), 9);
    // τ = 16·T/(π·d³) with T = T_m·1000·6·0.9/2 N·mm on the 5.0 mm neck (REFERENCES §6.1–6.2).
    const sf = (t: number) => ((60 * 0.6) / Math.sqrt(3)) / ((16 * t * 2700) / (Math.PI * 125));
    c.points.forEach((p, i) => expect(p.safetyFactor).toBeCloseTo(sf([0.1, 0.12, 0.15, 0.2, 0.25][i]!), 9));
    expect(c.points.map((p) => p.safetyFactor.toFixed(2))).toEqual(["1.89", "1.57", "1.26", "0.94", "0.76"]);
    expect(c.calibration).toMatchObject({ status: "separated", runs: 5, held: 2, worn: 1, broke: 2 });
    expect(c.calibration.lowestHeld).toBeCloseTo(0.18894 / 0.12, 4);
    expect(c.calibration.highestBroke).toBeCloseTo(0.18894 / 0.2, 4);
    // k = 1/√(1.5745 · 0.9447) = 0.81994; the derate 0.6 becomes 0.4920.
    expect(c.calibration.factor).toBeCloseTo(0.81994, 4);
    expect(c.proposal).toMatchObject({ derateNow: 0.6, derateAfter: 0.492, applicable: true });
    expect(c.proposal!.source).toMatch(/^calibrated from 5 test runs/);
  });

  it("applying asks for the kits it changes, then writes the new derate with its source and re-analyses them", async () => {
    const c = await calibrationOf(item.id);
    const sfBefore = await summarySf(kitId, 1);
    const body = { version: c.material.version, runs: 5, derate: c.proposal!.derateAfter };
    const ask = await call(applyRoute.POST, "POST", `/api/workspaces/${ws}/calibration/${item.id}`, { workspaceId: ws, materialId: item.id }, { cookie, body });
    expect(ask.status).toBe(409);
    expect(ask.json.error.code).toBe("confirm_kits");
    expect(ask.json.error.kits.map((k: { id: string }) => k.id)).toEqual([kitId]);

    const done = await call(applyRoute.POST, "POST", `/api/workspaces/${ws}/calibration/${item.id}`, { workspaceId: ws, materialId: item.id }, { cookie, body: { ...body, kits: ask.json.error.kits.map((k: { id: string; version: number }) => ({ id: k.id, version: k.version })) } });
    expect(done.status).toBe(200);
    expect(done.json.item.spec).toMatchObject({ derate: 0.492 });
    expect(done.json.item.spec.derateSource).toMatch(/^calibrated from 5 test runs \(\d{4}-\d{2}-\d{2}\): lowest safety factor that held 1\.57, highest that broke 0\.94/);
    // The kit's new revision predicts with the new figure: n scales with the derate (n ∝ S_sy, REFERENCES §6.1).
    expect(await summarySf(kitId, 2)).toBeCloseTo((sfBefore * 0.492) / 0.6, 9);

    // Calibrated again from the same runs, the line now sits where the runs put it.
    const after = await calibrationOf(item.id);
    expect(after.calibration.factor).toBeCloseTo(1, 3);
  });

  it("refuses to apply what the person did not see: 409 calibration_changed with the calibration of now", async () => {
    const c = await calibrationOf(item.id);
    const res = await call(applyRoute.POST, "POST", `/api/workspaces/${ws}/calibration/${item.id}`, { workspaceId: ws, materialId: item.id }, { cookie, body: { version: c.material.version, runs: 4, derate: c.proposal!.derateAfter } });
    expect(res.status).toBe(409);
    expect(res.json.error.code).toBe("calibration_changed");
    expect(res.json.error.calibration.calibration.runs).toBe(5);
  });
});

describe("calibration that cannot be applied", () => {
  it("runs that say the part is stronger than even the raw figure cannot raise it through a derate (422)", async () => {
    const item = await material("Test PETG print", {});
    const kitId = await kitWith(item, "PETG kit");
    await run(kitId, item.id, 0.4, "held"); // SF 0.472
    await run(kitId, item.id, 0.5, "broke"); // SF 0.378
    const c = await calibrationOf(item.id);
    expect(c.proposal).toMatchObject({ applicable: false });
    expect(c.proposal!.derateAfter).toBeGreaterThan(1);
    const res = await call(applyRoute.POST, "POST", `/api/workspaces/${ws}/calibration/${item.id}`, { workspaceId: ws, materialId: item.id }, { cookie, body: { version: c.material.version, runs: 2, derate: 1 } });
    expect(res.status).toBe(409); // the derate shown (1) is not the one of now (above 1)
  });

  it("overlapping runs give no factor, and applying says why", async () => {
    const item = await material("Test ASA print", {});
    const kitId = await kitWith(item, "ASA kit");
    await run(kitId, item.id, 0.2, "held");
    await run(kitId, item.id, 0.1, "broke");
    const c = await calibrationOf(item.id);
    expect(c.calibration.status).toBe("overlap");
    expect(c.proposal).toBeNull();
    const res = await call(applyRoute.POST, "POST", `/api/workspaces/${ws}/calibration/${item.id}`, { workspaceId: ws, materialId: item.id }, { cookie, body: { version: 1, runs: 2, derate: 0.5 } });
    expect(res.status).toBe(422);
    expect(res.json.error.code).toBe("not_calibrated");
  });

  it("a metal takes a calibrated derate too, and its kits' figures scale by it", async () => {
    const item = await material("Test bar 500", { printed: false, tensileYieldMpa: 500, derate: 1, derateSource: "" });
    const kitId = await kitWith(item, "Metal kit");
    // Allowable 500/√3 = 288.675 MPa; SF = 2.62412/T_m.
    await run(kitId, item.id, 1.5, "held"); // 1.7494
    await run(kitId, item.id, 2, "broke"); // 1.3121
    const c = await calibrationOf(item.id);
    const derate = c.proposal!.derateAfter;
    expect(derate).toBeCloseTo(1 / Math.sqrt((2.62412 / 1.5) * (2.62412 / 2)), 3); // the derate is kept to 4 decimals
    const sfBefore = await summarySf(kitId, 1);
    const res = await call(applyRoute.POST, "POST", `/api/workspaces/${ws}/calibration/${item.id}`, { workspaceId: ws, materialId: item.id }, { cookie, body: { version: 1, runs: 2, derate, kits: [{ id: kitId, version: 1 }] } });
    expect(res.status).toBe(200);
    expect(await summarySf(kitId, 2)).toBeCloseTo(sfBefore * derate, 9);
    // A metal's derate below 1 needs its source; without one the shelf refuses it, naming the field.
    const bad = await call(shelfItemRoute.PATCH, "PATCH", `/api/workspaces/${ws}/shelf/${item.id}`, { workspaceId: ws, itemId: item.id }, { cookie, body: { version: 2, spec: { ...res.json.item.spec, derateSource: "" }, kits: [{ id: kitId, version: 2 }] } });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields[0].path).toBe("spec.derate");
  });
});
