// Design search end to end: the routes on the real database, the batches on pg-boss, and real worker
// processes (scripts/search-worker.ts) taking them. A result is re-analysed through POST /api/analyze and
// judged against the aims; a worker killed mid-batch and a lost queue are survived; a cancel stops.
import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import * as analyzeRoute from "@/app/api/analyze/route";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as searchesRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/searches/route";
import * as searchRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/searches/[searchId]/route";
import * as cancelRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/searches/[searchId]/cancel/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { aimShortfalls, applyFigures, type SearchQuestion, type SearchView } from "@/contracts/design-search";
import { TARNWICK_10_BASE, TARNWICK_10_BELLCRANK } from "@/contracts/demo-layouts";
import { summarizeAnalysis } from "@/contracts/revisions";
import { judgeReadouts, type Targets } from "@/contracts/targets";
import { stopSearchBoss } from "@/server/search/search-queue";
import { call, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";
import { startWorker, stopWorker, type WorkerProcess } from "../helpers/search-workers";

// A batch held by a dead worker comes back after 3 s; pg-boss looks every second (the workers read these too).
vi.hoisted(() => {
  process.env.KB_SEARCH_BATCH_TIMEOUT_SECONDS = "3";
  process.env.KB_SEARCH_MAINTENANCE_SECONDS = "1";
});

const pool = new Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
let owner: string;
let viewer: string;
let outsider: string;
let ws: string;
let kit: string;
let workers: WorkerProcess[] = [];

const base = () => `/api/workspaces/${ws}/kits/${kit}/searches`;
const K = () => ({ workspaceId: ws, kitId: kit });
const start = (question: unknown, cookie = owner, kitId = kit) =>
  call(searchesRoute.POST, "POST", `/api/workspaces/${ws}/kits/${kitId}/searches`, { workspaceId: ws, kitId }, { cookie, body: question });
const read = (id: string, cookie = owner) => call(searchRoute.GET, "GET", `${base()}/${id}`, { ...K(), searchId: id }, { cookie });

async function until(id: string, test: (s: SearchView) => boolean, timeoutMs = 60_000): Promise<SearchView> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const s = (await read(id)).json.search as SearchView;
    if (test(s)) return s;
    if (Date.now() > end) throw new Error(`search ${id} not there within ${timeoutMs} ms: ${s.status} ${s.tried}/${s.planned}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

// The demo baseline steers 19.9° (worst over travel) at a safety factor of 15.3 with a 5 mm neck.
const AIMS: Targets = { minLockDeg: 26, maxJointAngleDeg: 40, minSafetyFactor: 10, ackermannMinPct: 0, ackermannMaxPct: 150, minNeckClearanceMm: 0.05 };
const MOVES: SearchQuestion["moves"] = [
  { key: "neckDiameterMm", min: 3.5, max: 6 },
  { key: "cupMouthDiameterMm", min: 7, max: 10 },
  { key: "pivotDepthMm", min: 0.5, max: 3 },
  { key: "ratedAngleDeg", min: 30, max: 45 },
  { key: "jointType", choices: ["dogbone", "cvd"] },
];

beforeAll(async () => {
  const o = await signUp("Search owner");
  const v = await signUp("Search viewer");
  owner = o.cookie;
  viewer = v.cookie;
  outsider = (await signUp("Search outsider")).cookie;
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner })).json.workspaces[0].id;
  await addMemberByInvitation(o, ws, v, "viewer");
  kit = (await call(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner, body: { name: "Searched baseline", scale: "1:10", layout: TARNWICK_10_BASE } })).json.kit.id;
  workers = [startWorker(), startWorker()];
  await Promise.all(workers.map((w) => w.waitFor(/waiting for batches/)));
});

afterAll(async () => {
  await Promise.all(workers.map((w) => stopWorker(w)));
  await stopSearchBoss();
  await pool.end();
});

describe("a design search", () => {
  it("asked for more lock than the baseline has at its safety factor, finds layouts that meet every aim when analysed again", async () => {
    const baseline = await call(analyzeRoute.POST, "POST", "/api/analyze", {}, { cookie: owner, body: { layout: TARNWICK_10_BASE } });
    const before = summarizeAnalysis(baseline.json.analysis);
    expect(before.lockDeg).toBeLessThan(AIMS.minLockDeg);
    expect(before.safetyFactor).toBeGreaterThan(AIMS.minSafetyFactor);

    const started = await start({ moves: MOVES, aims: AIMS, prefer: "most-lock", samples: 288 });
    expect(started.status).toBe(202);
    expect(started.json.search.status).toBe("running");
    const done = await until(started.json.search.id, (s) => s.status !== "running");
    expect(done.status).toBe("done");
    const answer = done.answer!;
    expect(answer.outcome).toBe("met");
    expect(answer.tried).toBe(done.tried);
    expect(done.tried).toBeGreaterThanOrEqual(288);
    expect(answer.current.readouts.lockDeg).toBeCloseTo(before.lockDeg, 6);
    expect(answer.best.length).toBeGreaterThanOrEqual(1);
    // Most lock first.
    for (let i = 1; i < answer.best.length; i++) expect(answer.best[i]!.readouts.lockDeg!).toBeLessThanOrEqual(answer.best[i - 1]!.readouts.lockDeg!);
    for (const c of answer.best.slice(0, 3)) {
      const again = await call(analyzeRoute.POST, "POST", "/api/analyze", {}, { cookie: owner, body: { layout: applyFigures(TARNWICK_10_BASE, c.values) } });
      expect(again.status).toBe(200);
      const s = summarizeAnalysis(again.json.analysis);
      const verdicts = judgeReadouts({ lockDeg: s.lockDeg, maxJointAngleDeg: s.maxJointAngleDeg, ackermannPct: s.ackermannPct, safetyFactor: s.safetyFactor, neckClearanceMm: s.neckClearanceMm }, AIMS);
      expect(verdicts).toEqual({ lockDeg: "meets", maxJointAngleDeg: "meets", ackermannPct: "meets", safetyFactor: "meets", neckClearanceMm: "meets" });
      expect(s.lockDeg).toBeGreaterThan(before.lockDeg + 5);
    }
    // The front: no layout on it has both less lock and less safety factor than another on it (one layout can
    // beat all the others on both: the front is then that one), and it reaches at least the best layout's lock.
    expect(answer.front.length).toBeGreaterThanOrEqual(1);
    expect(Math.max(...answer.front.map((c) => c.readouts.lockDeg!))).toBeGreaterThanOrEqual(answer.best[0]!.readouts.lockDeg! - 1e-9);
    for (const a of answer.front) for (const b of answer.front) if (a !== b) expect(b.readouts.lockDeg! >= a.readouts.lockDeg! && b.readouts.safetyFactor! > a.readouts.safetyFactor!).toBe(false);
    // Viewers read it; the list names it.
    expect((await read(done.id, viewer)).json.search.answer.outcome).toBe("met");
    const list = await call(searchesRoute.GET, "GET", base(), K(), { cookie: viewer });
    expect(list.json.searches.map((s: SearchView) => s.id)).toContain(done.id);
  });

  it("whose aims cannot all be met says which aim fails and by how much, with the nearest layouts", async () => {
    const aims = { ...AIMS, minLockDeg: 45, minSafetyFactor: 14 };
    const started = await start({ moves: MOVES.slice(0, 3), aims, prefer: "strongest", samples: 96 });
    expect(started.status).toBe(202);
    const done = await until(started.json.search.id, (s) => s.status !== "running");
    const answer = done.answer!;
    expect(answer.outcome).toBe("not-met");
    expect(answer.best.length).toBeGreaterThanOrEqual(1);
    const nearest = answer.best[0]!;
    const lock = answer.failing.find((f) => f.aim === "minLockDeg");
    expect(lock).toBeDefined();
    expect(lock!.shortfall).toBeCloseTo(45 - nearest.readouts.lockDeg!, 6);
    expect(lock!.shortfall).toBeGreaterThan(0);
    // The nearest layout is as near as any: no analysed layout misses by less in total.
    for (const c of answer.best) expect(c.violation).toBeGreaterThanOrEqual(nearest.violation);
    expect(Object.keys(aimShortfalls(nearest.readouts, aims)).sort()).toEqual(answer.failing.map((f) => f.aim).sort());
  });

  it("completes when a worker is killed in the middle of a batch (the batch is retried)", async () => {
    const started = await start({ moves: MOVES, aims: AIMS, prefer: "strongest", samples: 960 });
    const id = started.json.search.id as string;
    const victim = workers[0]!;
    await victim.waitFor(new RegExp(`batch ${id}/\\d+ started`));
    victim.proc.kill("SIGKILL");
    const line = victim.lines.filter((l) => l.includes(id)).at(-1)!;
    expect(line).toMatch(/started$/);
    const done = await until(id, (s) => s.status !== "running", 90_000);
    expect(done.status).toBe("done");
    expect(done.answer!.tried).toBe(done.tried);
    // Every batch recorded once; the killed one was taken again (pg-boss counted a retry).
    const batches = await pool.query("select count(*)::int as n, sum(tried)::int as tried from design_search_batches where search_id = $1 and status = 'done'", [id]);
    expect(batches.rows[0].tried).toBe(done.tried);
    const retried = await pool.query("select count(*)::int as n from pgboss.job where name = 'design-search-batch' and data->>'searchId' = $1 and retry_count > 0", [id]);
    expect(retried.rows[0].n).toBeGreaterThanOrEqual(1);
    workers[0] = startWorker();
    await workers[0].waitFor(/waiting for batches/);
  });

  it("resumes a running search whose queued batches were lost, once a worker starts again", async () => {
    await Promise.all(workers.map((w) => stopWorker(w)));
    const started = await start({ moves: MOVES.slice(0, 2), aims: AIMS, prefer: "least-change", samples: 96 });
    const id = started.json.search.id as string;
    // The queue loses them (as a database restored without the pgboss schema would).
    const lost = await pool.query("delete from pgboss.job where name = 'design-search-batch' and data->>'searchId' = $1", [id]);
    expect(lost.rowCount).toBeGreaterThan(0);
    workers = [startWorker(), startWorker()];
    expect(await workers[0]!.waitFor(/resumed \d+ running search/)).toMatch(/resumed [1-9]/);
    const done = await until(id, (s) => s.status !== "running");
    expect(done.status).toBe("done");
    expect(done.tried).toBeGreaterThanOrEqual(96);
  });

  it("cancelled, stops within a few seconds and leaves nothing on the queue", async () => {
    const started = await start({ moves: MOVES, aims: AIMS, prefer: "most-lock", samples: 4096 });
    const id = started.json.search.id as string;
    await until(id, (s) => s.tried > 0);
    const cancelled = await call(cancelRoute.POST, "POST", `${base()}/${id}/cancel`, { ...K(), searchId: id }, { cookie: owner });
    expect(cancelled.status).toBe(200);
    expect(cancelled.json.search.status).toBe("cancelled");
    const at = Date.now();
    for (;;) {
      const left = await pool.query("select count(*)::int as n from pgboss.job where name = 'design-search-batch' and data->>'searchId' = $1 and state in ('created', 'retry', 'active')", [id]);
      if (left.rows[0].n === 0) break;
      expect(Date.now() - at).toBeLessThan(3000);
      await new Promise((r) => setTimeout(r, 100));
    }
    const settled = (await read(id)).json.search as SearchView;
    await new Promise((r) => setTimeout(r, 1000));
    const later = (await read(id)).json.search as SearchView;
    expect(later.status).toBe("cancelled");
    expect(later.tried).toBe(settled.tried);
    expect(later.tried).toBeLessThan(4096);
    // Cancelling again is a conflict, not a 500.
    expect((await call(cancelRoute.POST, "POST", `${base()}/${id}/cancel`, { ...K(), searchId: id }, { cookie: owner })).status).toBe(409);
  });
});

describe("design search routes", () => {
  it("let viewers read and editors start; others are refused", async () => {
    const q = { moves: MOVES.slice(0, 1), aims: AIMS, prefer: "most-lock", samples: 16 };
    expect((await start(q, viewer)).status).toBe(403);
    expect((await start(q, outsider)).status).toBe(403);
    expect((await call(searchesRoute.POST, "POST", base(), K(), { body: q })).status).toBe(401);
    expect((await call(searchesRoute.GET, "GET", base(), K(), { cookie: outsider })).status).toBe(403);
    expect((await call(searchesRoute.GET, "GET", base(), K(), { cookie: viewer })).status).toBe(200);
    expect((await read("00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await read("not-an-id")).status).toBe(404);
  });

  it("refuse a bad question naming the field", async () => {
    const bad = async (question: unknown, path: string) => {
      const res = await start(question);
      expect(res.status).toBe(422);
      expect(res.json.error.fields.map((f: { path: string }) => f.path)).toContain(path);
    };
    await bad({ moves: [{ key: "wingSpan", min: 1, max: 2 }], aims: AIMS, prefer: "most-lock" }, "moves[0].key");
    await bad({ moves: [{ key: "neckDiameterMm", min: 6, max: 3 }], aims: AIMS, prefer: "most-lock" }, "moves[0].min");
    await bad({ moves: [{ key: "neckDiameterMm", min: 0.1, max: 3 }], aims: AIMS, prefer: "most-lock" }, "moves[0].min");
    await bad({ moves: [{ key: "jointType", choices: ["rubber band"] }], aims: AIMS, prefer: "most-lock" }, "moves[0].choices[0]");
    await bad({ moves: [], aims: AIMS, prefer: "most-lock" }, "moves");
    await bad({ moves: MOVES, aims: { ...AIMS, minLockDeg: "lots" }, prefer: "most-lock" }, "aims.minLockDeg");
    await bad({ moves: MOVES, aims: AIMS, prefer: "fastest" }, "prefer");
    await bad({ moves: MOVES, aims: AIMS, prefer: "most-lock", samples: 1e6 }, "samples");
    const bellcrank = (await call(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner, body: { name: "Bellcrank", scale: "1:10", layout: TARNWICK_10_BELLCRANK } })).json.kit.id;
    const res = await start({ moves: [{ key: "rackTravelMm", min: 5, max: 8 }], aims: AIMS, prefer: "most-lock" }, owner, bellcrank);
    expect(res.status).toBe(422);
    expect(res.json.error.message).toMatch(/Rack travel does not apply/);
  });
});
