// Time to make the demo kit's exports at the API of the production server, one request at a time (what a
// person clicking Export waits for): the dimension sheet (A4 portrait) and the 121 × 121 steer × travel
// envelope CSV, beside GET /api/health in the same run. Targets: each under 2 s (median and slowest).
import { TARNWICK_10_BASE } from "../src/contracts/demo-layouts";

const base = process.env.BENCH_BASE_URL;
if (!base) {
  console.error("bench-exports: BENCH_BASE_URL is not set (run it through `npm run bench`)");
  process.exit(1);
}
const host = new URL(base).hostname;
if (host !== "127.0.0.1" && host !== "localhost" && host !== "::1") {
  console.error("bench-exports: refusing to load anything but loopback");
  process.exit(1);
}
const origin = new URL(base).origin;
const samples = Number(process.env.BENCH_EXPORT_SAMPLES ?? 7);
const TARGET_MS = 2000;

async function json<T>(path: string, init: RequestInit & { cookie?: string } = {}): Promise<{ res: Response; body: T }> {
  const headers: Record<string, string> = { origin, ...(init.body ? { "content-type": "application/json" } : {}), ...(init.cookie ? { cookie: init.cookie } : {}) };
  const res = await fetch(base + path, { ...init, headers });
  return { res, body: (await res.json()) as T };
}

const signUp = await fetch(`${base}/api/auth/sign-up/email`, {
  method: "POST",
  headers: { "content-type": "application/json", origin },
  body: JSON.stringify({ name: "Bench Exporter", email: `bench-exports-${Date.now()}@bench.example`, password: "bench-password-1" }),
});
if (!signUp.ok) throw new Error(`sign-up failed: ${signUp.status} ${await signUp.text()}`);
const cookie = signUp.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
const { body: list } = await json<{ workspaces: { id: string }[] }>("/api/workspaces", { cookie });
const ws = list.workspaces[0]!.id;
const { res: made, body: created } = await json<{ kit: { id: string } }>(`/api/workspaces/${ws}/kits`, {
  method: "POST",
  cookie,
  body: JSON.stringify({ name: "Tarnwick 10 — 5.0 mm steel dogbone", scale: "1:10", layout: TARNWICK_10_BASE }),
});
if (made.status !== 201) throw new Error(`creating the demo kit failed: ${made.status}`);
const kit = `/api/workspaces/${ws}/kits/${created.kit.id}/exports`;

type Figure = { median: number; max: number; bytes: number };
let failures = 0;

/** Times `samples` whole requests (headers to the last byte), after one unmeasured warm-up. */
async function time(path: string, withCookie: boolean): Promise<Figure> {
  const one = async () => {
    const t = performance.now();
    const res = await fetch(base + path, { headers: withCookie ? { cookie } : {} });
    const bytes = (await res.arrayBuffer()).byteLength;
    if (!res.ok) failures++;
    return { ms: performance.now() - t, bytes };
  };
  await one();
  const runs: { ms: number; bytes: number }[] = [];
  for (let i = 0; i < samples; i++) runs.push(await one());
  const ms = runs.map((r) => r.ms).sort((a, b) => a - b);
  return { median: ms[Math.floor(ms.length / 2)]!, max: ms.at(-1)!, bytes: runs[0]!.bytes };
}

const health = await time("/api/health", false);
const sheet = await time(`${kit}/sheet.pdf?paper=a4&orientation=portrait&unit=mm`, true);
const envelope = await time(`${kit}/envelope.csv?travelSteps=121&steerSteps=121&unit=mm`, true);

const line = (title: string, f: Figure, target: boolean) => {
  const verdict = target ? (f.median < TARGET_MS && f.max < TARGET_MS ? "  (target < 2 s: met)" : "  (target < 2 s: NOT met)") : "";
  console.log(`  ${title.padEnd(44)} median ${f.median.toFixed(1).padStart(7)} ms   slowest ${f.max.toFixed(1).padStart(7)} ms   ${(f.bytes / 1024).toFixed(0).padStart(5)} KiB   ×${(f.median / health.median).toFixed(0)} health${verdict}`);
};
console.log(`Exports of the demo kit, ${samples} requests each, one at a time, loopback:`);
line("GET /api/health (baseline)", health, false);
line("GET …/exports/sheet.pdf (A4 portrait)", sheet, true);
line("GET …/exports/envelope.csv (121 × 121)", envelope, true);
if (failures > 0) {
  console.error(`bench-exports: ${failures} requests failed; the figures above are not to be trusted`);
  process.exitCode = 1;
}
