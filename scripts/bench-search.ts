// Analyses per second of a design search on the demo baseline, through the production server and the
// design-search workers that `npm run bench` started (their count is the argument). Each run is kept in
// .data/bench-search.json; the run with 2 workers prints its ratio to the run with 1.
// Usage (through npm run bench): tsx scripts/bench-search.ts WORKERS
import { readFileSync, writeFileSync } from "node:fs";
import type { SearchQuestion, SearchView } from "../src/contracts/design-search";
import { TARNWICK_10_BASE } from "../src/contracts/demo-layouts";

const base = process.env.BENCH_BASE_URL;
if (!base) {
  console.error("bench-search: BENCH_BASE_URL is not set (run it through `npm run bench`)");
  process.exit(1);
}
const workers = Number(process.argv[2] ?? 1);
const origin = new URL(base).origin;
const SAMPLES = Number(process.env.BENCH_SEARCH_SAMPLES ?? 2400);
const RESULTS = ".data/bench-search.json";

async function json<T>(path: string, init: RequestInit & { cookie?: string } = {}): Promise<{ res: Response; body: T }> {
  const headers: Record<string, string> = { origin, ...(init.body ? { "content-type": "application/json" } : {}), ...(init.cookie ? { cookie: init.cookie } : {}) };
  const res = await fetch(base + path, { ...init, headers });
  return { res, body: (await res.json()) as T };
}

const signUp = await fetch(`${base}/api/auth/sign-up/email`, {
  method: "POST",
  headers: { "content-type": "application/json", origin },
  body: JSON.stringify({ name: "Bench Searcher", email: `bench-search-${Date.now()}@bench.example`, password: "bench-password-1" }),
});
if (!signUp.ok) throw new Error(`sign-up failed: ${signUp.status} ${await signUp.text()}`);
const cookie = signUp.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
const ws = (await json<{ workspaces: { id: string }[] }>("/api/workspaces", { cookie })).body.workspaces[0]!.id;
const { body: made } = await json<{ kit: { id: string } }>(`/api/workspaces/${ws}/kits`, { method: "POST", cookie, body: JSON.stringify({ name: "Tarnwick 10 — bench search", scale: "1:10", layout: TARNWICK_10_BASE }) });
const searches = `/api/workspaces/${ws}/kits/${made.kit.id}/searches`;

const question = (samples: number): SearchQuestion => ({
  moves: [
    { key: "neckDiameterMm", min: 3.5, max: 6 },
    { key: "cupMouthDiameterMm", min: 7, max: 10 },
    { key: "pivotDepthMm", min: 0.5, max: 3 },
    { key: "ratedAngleDeg", min: 30, max: 45 },
    { key: "jointType", choices: ["dogbone", "cvd"] },
  ],
  aims: { minLockDeg: 26, maxJointAngleDeg: 40, minSafetyFactor: 10, ackermannMinPct: 0, ackermannMaxPct: 150, minNeckClearanceMm: 0.05 },
  prefer: "most-lock",
  samples,
});

async function run(samples: number): Promise<SearchView> {
  const { res, body } = await json<{ search: SearchView }>(searches, { method: "POST", cookie, body: JSON.stringify(question(samples)) });
  if (res.status !== 202) throw new Error(`starting the search failed: ${res.status} ${JSON.stringify(body)}`);
  for (;;) {
    const { body: now } = await json<{ search: SearchView }>(`${searches}/${body.search.id}`, { cookie });
    if (now.search.status !== "running") return now.search;
    await new Promise((r) => setTimeout(r, 100));
  }
}

// A small search first, so every worker is up and warm before the clock starts.
await run(16 * workers);
const done = await run(SAMPLES);
if (done.status !== "done") throw new Error(`the search ended ${done.status}`);
const seconds = (Date.parse(done.finishedAt!) - Date.parse(done.createdAt)) / 1000;
const rate = done.tried / seconds;
console.log(`design search, ${workers} worker${workers === 1 ? "" : "s"}: ${done.tried} layouts analysed in ${seconds.toFixed(2)} s — ${rate.toFixed(0)} analyses/s (answer: ${done.answer?.outcome})`);
let kept: Record<string, number> = {};
try {
  kept = JSON.parse(readFileSync(RESULTS, "utf8")) as Record<string, number>;
} catch {
  // first run
}
if (workers === 1) kept = {};
kept[String(workers)] = rate;
writeFileSync(RESULTS, JSON.stringify(kept));
if (workers > 1 && kept["1"]) console.log(`design search, ${workers} workers against 1: ×${(rate / kept["1"]).toFixed(2)} the analyses per second`);
