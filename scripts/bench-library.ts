// The library table at scale: one workspace of 5,000 kits (made here, in the bench's own database), and a
// page of 50 of them sorted by a readout column, answered by GET /api/workspaces/{w}/kits, timed one request
// at a time beside GET /api/health in the same run (alternating, so drift falls on both). Prints the median
// and p95 of each and their ratio; target: the page's median under 100 ms.
import { randomUUID } from "node:crypto";
import { Pool } from "pg";
import { DEMO_LAYOUTS } from "../src/contracts/demo-layouts";
import type { Layout } from "../src/contracts/layout";
import { summarizeAnalysis } from "../src/contracts/revisions";
import { analyzeLayout, GeometryError } from "../src/engine";

const base = process.env.BENCH_BASE_URL;
const databaseUrl = process.env.DATABASE_URL;
if (!base || !databaseUrl) {
  console.error("bench-library: BENCH_BASE_URL and DATABASE_URL must be set (run it through `npm run bench`)");
  process.exit(1);
}
if (!["127.0.0.1", "localhost", "[::1]"].includes(new URL(base).hostname)) {
  console.error("bench-library: refusing to load anything but loopback");
  process.exit(1);
}
const KITS = Number(process.env.BENCH_LIBRARY_KITS ?? 5000);
const SAMPLES = Number(process.env.BENCH_LIBRARY_SAMPLES ?? 200);
const PAGE_SIZE = 50;

async function signUp(): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-up/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: new URL(base!).origin },
    body: JSON.stringify({ name: "Library Bench", email: `library-${randomUUID().slice(0, 8)}@bench.example`, password: "bench-password-1" }),
  });
  if (!res.ok) throw new Error(`sign-up failed: ${res.status} ${await res.text()}`);
  return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

/** Distinct layouts to spread over the kits: the demo variants with their neck and cup stepped, each analysed once. */
function variants(): { layout: Layout; summary: object }[] {
  const out: { layout: Layout; summary: object }[] = [];
  for (const d of DEMO_LAYOUTS) {
    for (let i = 0; i < 8; i++) {
      for (let j = 0; j < 3; j++) {
        const neckDiameterMm = Number((3.6 + i * 0.25).toFixed(2));
        const cupMouthDiameterMm = Math.max(d.layout.drive.cupMouthDiameterMm + j * 0.5, neckDiameterMm + 1);
        const layout: Layout = { ...d.layout, drive: { ...d.layout.drive, neckDiameterMm, cupMouthDiameterMm } };
        try {
          out.push({ layout, summary: { ok: true, ...summarizeAnalysis(analyzeLayout(layout)) } });
        } catch (error) {
          if (!(error instanceof GeometryError)) throw error; // a combination that cannot be built is left out
        }
      }
    }
  }
  return out;
}

const SCALES = ["1:10", "1:8", "1:10", "1:12"];
const TAGS = ["race", "steel", "printed", "cvd", "club", "test part", "lock", "2026"];

async function fill(pool: Pool, workspaceId: string, userId: string): Promise<void> {
  const layouts = variants();
  const started = performance.now();
  for (let from = 0; from < KITS; from += 500) {
    const n = Math.min(500, KITS - from);
    const rows: unknown[] = [];
    const values: string[] = [];
    for (let k = 0; k < n; k++) {
      const i = from + k;
      const v = layouts[(i * 7919) % layouts.length]!;
      const s = v.summary as { lockDeg: number; lockLimitedBy: string; maxJointAngleDeg: number; ackermannPct: number | null; safetyFactor: number; neckClearanceMm: number | null };
      const tags = [TAGS[i % TAGS.length]!, TAGS[(i * 3 + 1) % TAGS.length]!].filter((t, x, a) => a.indexOf(t) === x);
      const p = rows.length;
      values.push(`($${p + 1}, $${p + 2}, $${p + 3}, $${p + 4}, $${p + 5}, $${p + 6}, $${p + 7}, $${p + 8}, $${p + 9}, $${p + 10}, $${p + 11}, $${p + 12}, now() - ($${p + 13} || ' minutes')::interval)`);
      rows.push(workspaceId, `Bench kit ${String(i + 1).padStart(5, "0")}`, SCALES[i % SCALES.length], `{${tags.map((t) => `"${t}"`).join(",")}}`, s.lockDeg, s.lockLimitedBy, s.maxJointAngleDeg, s.ackermannPct, s.safetyFactor, s.neckClearanceMm, userId, userId, String(i));
    }
    const { rows: made } = await pool.query<{ id: string }>(
      `insert into kits (workspace_id, name, scale, tags, lock_deg, lock_limited_by, max_joint_angle_deg, ackermann_pct, safety_factor, neck_clearance_mm, created_by, updated_by, updated_at)
       values ${values.join(", ")} returning id`,
      rows,
    );
    // Every kit has its revision 1 (its layout and cached summary), as the app would make it.
    const revRows: unknown[] = [];
    const revValues = made.map((m, k) => {
      const v = layouts[((from + k) * 7919) % layouts.length]!;
      revRows.push(m.id, JSON.stringify(v.layout), JSON.stringify(v.summary), userId);
      return `($${k * 4 + 1}, 1, $${k * 4 + 2}::jsonb, $${k * 4 + 3}::jsonb, 'create', $${k * 4 + 4})`;
    });
    await pool.query(`insert into kit_revisions (kit_id, number, layout, summary, kind, author_id) values ${revValues.join(", ")}`, revRows);
  }
  await pool.query("analyze kits");
  console.log(`  made ${KITS} kits (${layouts.length} distinct analysed layouts) in ${((performance.now() - started) / 1000).toFixed(1)} s`);
}

async function timed(url: string, cookie?: string): Promise<number> {
  const t = performance.now();
  const res = await fetch(url, { headers: cookie ? { cookie } : {} });
  await res.arrayBuffer();
  const ms = performance.now() - t;
  if (!res.ok) throw new Error(`${url} answered ${res.status}`);
  return ms;
}

// Nearest-rank percentile.
const rank = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil(q * s.length) - 1)]!;
};

const cookie = await signUp();
const me = (await (await fetch(`${base}/api/workspaces`, { headers: { cookie } })).json()) as { workspaces: { id: string }[] };
const workspaceId = me.workspaces[0]!.id;
const pool = new Pool({ connectionString: databaseUrl, max: 2 });
try {
  const { rows } = await pool.query<{ id: string }>("select user_id as id from workspace_members where workspace_id = $1 limit 1", [workspaceId]);
  console.log(`Library page of ${PAGE_SIZE} from ${KITS} kits in one workspace, sorted by a readout column, ${SAMPLES} requests each, one at a time:`);
  await fill(pool, workspaceId, rows[0]!.id);
} finally {
  await pool.end();
}

const pages = Math.ceil(KITS / PAGE_SIZE);
const sorts = ["safetyFactor", "lockDeg", "maxJointAngleDeg"];
// Pages spread over the whole list (deep offsets cost more than the first page), sorts and directions taken in turn.
const pageUrl = (i: number) => `${base}/api/workspaces/${workspaceId}/kits?sort=${sorts[i % sorts.length]}&dir=${i % 2 ? "asc" : "desc"}&page=${1 + ((i * 37) % pages)}&size=${PAGE_SIZE}`;

const first = await fetch(pageUrl(0), { headers: { cookie } });
const body = (await first.json()) as { kits: unknown[]; total: number };
if (!first.ok || body.kits.length !== PAGE_SIZE || body.total !== KITS) throw new Error(`the library answered ${first.status} with ${body.kits?.length} kits of ${body.total}`);
for (let i = 0; i < 20; i++) {
  await timed(`${base}/api/health`);
  await timed(pageUrl(i), cookie);
}

const health: number[] = [];
const library: number[] = [];
for (let i = 0; i < SAMPLES; i++) {
  health.push(await timed(`${base}/api/health`));
  library.push(await timed(pageUrl(i), cookie));
}
const ms = (x: number) => `${x.toFixed(2)} ms`;
const hMed = rank(health, 0.5);
const lMed = rank(library, 0.5);
console.log(`  GET /api/health (baseline)            median ${ms(hMed)}   p95 ${ms(rank(health, 0.95))}`);
console.log(`  GET …/kits, page of ${PAGE_SIZE}, readout sort   median ${ms(lMed)}   p95 ${ms(rank(library, 0.95))}`);
console.log(`  ratio library / health: median ${(lMed / hMed).toFixed(1)}×`);
console.log(`  target: library median under 100 ms: ${lMed < 100 ? "met" : "NOT met"}`);
