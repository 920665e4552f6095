// HTTP throughput of POST /api/analyze against the trivial GET /api/health of the same production
// server, in one run, on loopback, bounded in time. Prints both rates and their ratio (target ≥ 0.5).
// Then the health route's latency (median and p95) idle and while ten connections keep largest-grid
// analyses going, and the loaded / idle ratio of each: interactive routes must stay responsive under load.
import autocannon from "autocannon";
import { TARNWICK_10_BASE } from "../src/contracts/demo-layouts";

const base = process.env.BENCH_BASE_URL;
if (!base) {
  console.error("bench-http: BENCH_BASE_URL is not set (run it through `npm run bench`)");
  process.exit(1);
}
const host = new URL(base).hostname;
if (host !== "127.0.0.1" && host !== "localhost" && host !== "::1") {
  console.error("bench-http: refusing to load anything but loopback");
  process.exit(1);
}
const seconds = Number(process.env.BENCH_HTTP_SECONDS ?? 4);
const connections = Number(process.env.BENCH_HTTP_CONNECTIONS ?? 8);

async function signUp(): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-up/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: new URL(base!).origin },
    body: JSON.stringify({ name: "Bench Runner", email: `bench-${Date.now()}@bench.example`, password: "bench-password-1" }),
  });
  if (!res.ok) throw new Error(`sign-up failed: ${res.status} ${await res.text()}`);
  return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

type Run = { rps: number; p50: number; p99: number; non2xx: number; errors: number };

type Target = { path: string; method?: "GET" | "POST"; headers?: Record<string, string>; body?: string };

async function load(title: string, target: Target): Promise<Run> {
  const { path, ...rest } = target;
  const r = await autocannon({ url: base + path, connections, duration: seconds, ...rest });
  const run = { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, non2xx: r.non2xx, errors: r.errors };
  console.log(`  ${title.padEnd(40)} ${run.rps.toFixed(0).padStart(6)} req/s   p50 ${run.p50} ms   p99 ${run.p99} ms   non-2xx ${run.non2xx}   errors ${run.errors}`);
  return run;
}

const cookie = await signUp();
const body = JSON.stringify({ layout: TARNWICK_10_BASE });
// The Origin a browser sends with every POST: the write routes refuse a cookie without it (403 cross_origin).
const analyze: Target = { path: "/api/analyze", method: "POST", headers: { "content-type": "application/json", origin: new URL(base).origin, cookie }, body };

// Warm both routes (JIT, connection pools) before measuring.
await autocannon({ url: `${base}/api/health`, connections: 2, amount: 200 });
await autocannon({ url: `${base}/api/analyze`, connections: 2, amount: 200, method: "POST", headers: analyze.headers, body });

// Alternate the two routes over a few rounds so drift (JIT, CPU clock, the load generator sharing the
// two cores) falls on both alike; the ratio quoted is that of the medians.
const rounds = Number(process.env.BENCH_HTTP_ROUNDS ?? 3);
console.log(`HTTP throughput, ${connections} connections, ${rounds} rounds of ${seconds} s per route, loopback:`);
const healthRuns: Run[] = [];
const analysisRuns: Run[] = [];
for (let i = 0; i < rounds; i++) {
  healthRuns.push(await load(`GET /api/health (baseline) #${i + 1}`, { path: "/api/health" }));
  analysisRuns.push(await load(`POST /api/analyze (demo kit, 21×41) #${i + 1}`, analyze));
}
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const healthRps = median(healthRuns.map((r) => r.rps));
const analysisRps = median(analysisRuns.map((r) => r.rps));
const ratio = analysisRps / healthRps;
console.log(`  median: health ${healthRps.toFixed(0)} req/s, analyze ${analysisRps.toFixed(0)} req/s`);
console.log(`  ratio analyze / health: ${ratio.toFixed(2)} (target ≥ 0.50) ${ratio >= 0.5 ? "met" : "NOT met"}`);

// --- health latency under analysis load ---------------------------------------------------------
const floodConnections = Number(process.env.BENCH_FLOOD_CONNECTIONS ?? 10);
const largest = JSON.stringify({ layout: TARNWICK_10_BASE, grid: { travelSteps: 81, steerSteps: 121 } });
// One request at a time, timed here (autocannon rounds latencies to whole milliseconds): each sample is
// the wait a person clicking would see.
type Probe = { p50: number; p95: number; samples: number; failed: number };
async function probe(): Promise<Probe> {
  const samples: number[] = [];
  let failed = 0;
  const until = performance.now() + seconds * 1000;
  while (performance.now() < until) {
    const t = performance.now();
    const res = await fetch(`${base}/api/health`);
    await res.arrayBuffer();
    samples.push(performance.now() - t);
    if (!res.ok) failed++;
  }
  const sorted = samples.sort((a, b) => a - b);
  // Nearest-rank percentiles over the run's samples.
  const rank = (q: number) => sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)]!;
  return { p50: rank(0.5), p95: rank(0.95), samples: sorted.length, failed };
}
const ms = (x: number) => `${x.toFixed(2)} ms`;
console.log(`Health latency idle and under ${floodConnections} concurrent largest-grid (81×121) analyses, ${seconds} s each:`);
const idleRuns: Probe[] = [];
const loadedRuns: Probe[] = [];
let floodOk = 0;
let floodBusy = 0;
let floodOther = 0;
await probe(); // warm the probe's connection
for (let i = 0; i < rounds; i++) {
  const idle = await probe();
  idleRuns.push(idle);
  const [loaded, flood] = await Promise.all([
    probe(),
    // A largest-grid analysis can wait long in the queue: no client timeout, so none is miscounted as a failure.
    autocannon({ url: `${base}/api/analyze`, connections: floodConnections, duration: seconds, timeout: 120, method: "POST", headers: analyze.headers, body: largest }),
  ]);
  loadedRuns.push(loaded);
  const codes = (flood.statusCodeStats ?? {}) as Record<string, { count?: number }>;
  const count = (code: string) => codes[code]?.count ?? 0;
  floodOk += count("200");
  floodBusy += count("429");
  floodOther += flood.requests.total - count("200") - count("429") + flood.errors + idle.failed + loaded.failed;
  console.log(`  #${i + 1}  idle median ${ms(idle.p50)} p95 ${ms(idle.p95)} (${idle.samples})   loaded median ${ms(loaded.p50)} p95 ${ms(loaded.p95)} (${loaded.samples})   analyses 200: ${count("200")}, 429 busy: ${count("429")}`);
}
// Each figure is the median over the rounds, so one noisy round does not decide it.
const idleP50 = median(idleRuns.map((r) => r.p50));
const loadedP50 = median(loadedRuns.map((r) => r.p50));
const idleP95 = median(idleRuns.map((r) => r.p95));
const loadedP95 = median(loadedRuns.map((r) => r.p95));
const slowdown = loadedP50 / idleP50;
console.log(`  health idle:                median ${ms(idleP50)}   p95 ${ms(idleP95)}`);
console.log(`  health under analysis load: median ${ms(loadedP50)}   p95 ${ms(loadedP95)}`);
console.log(`  ratio loaded / idle: median ${slowdown.toFixed(2)} (target ≤ 4) ${slowdown <= 4 ? "met" : "NOT met"}   p95 ${(loadedP95 / idleP95).toFixed(2)}`);
console.log(`  analyses during the load: ${floodOk} done, ${floodBusy} refused busy (429)`);
if (floodOther > 0) {
  console.error(`bench-http: ${floodOther} health or analysis requests failed other than 429 busy`);
  process.exitCode = 1;
}

if ([...healthRuns, ...analysisRuns].some((r) => r.non2xx || r.errors)) {
  console.error("bench-http: some requests failed; the figures above are not to be trusted");
  process.exitCode = 1;
}
