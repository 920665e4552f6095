// A bounded queue in front of the analysis workers: one worker here (tests/vitest.config.ts) and room for
// two waiting jobs, so a flood of the largest grid gets 429 with Retry-After and what was taken completes.
import { availableParallelism } from "node:os";
import { beforeAll, describe, expect, it, vi } from "vitest";
import * as analyzeRoute from "@/app/api/analyze/route";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { analysisQueueLimit, analysisWorkerCount } from "@/server/analysis/pool";
import { call, signUp } from "../helpers/api";

vi.hoisted(() => {
  process.env.KB_ANALYSIS_QUEUE = "2";
});

const LARGEST = { travelSteps: 81, steerSteps: 121 };
let cookie: string;
const analyze = (grid?: object) => call(analyzeRoute.POST, "POST", "/api/analyze", {}, { cookie, body: { layout: TARNWICK_10_BASE, grid } });

beforeAll(async () => {
  cookie = (await signUp("Wren Castellan")).cookie;
  // Start the worker (tsx takes a while) so the flood below meets a running pool.
  expect((await analyze({ travelSteps: 2, steerSteps: 3 })).status).toBe(200);
});

describe("the analysis queue", () => {
  it("refuses a flood beyond one running and two waiting with 429 and Retry-After; the accepted ones complete", async () => {
    const answers = await Promise.all(Array.from({ length: 12 }, () => analyze(LARGEST)));
    const done = answers.filter((a) => a.status === 200);
    const refused = answers.filter((a) => a.status !== 200);
    // All twelve reach the pool within a millisecond or two, while the first largest grid takes tens.
    expect(done.length).toBe(3);
    expect(refused.length).toBe(9);
    for (const a of done) {
      expect(a.json.analysis.grid).toEqual(LARGEST);
      expect(a.json.analysis.travel).toHaveLength(81);
    }
    for (const a of refused) {
      expect(a.status).toBe(429);
      expect(a.json.error.code).toBe("busy");
      expect(Number(a.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
    }
    // Drained: the next one is taken again.
    expect((await analyze(LARGEST)).status).toBe(200);
  });

  it("takes work at the pace the workers finish it: sequential requests are never refused", async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await analyze(LARGEST)).status);
    expect(statuses).toEqual(Array(6).fill(200));
  });
});

describe("pool sizing", () => {
  it("leaves the event loop a core unless KB_ANALYSIS_WORKERS says otherwise", () => {
    expect(analysisWorkerCount(1, undefined)).toBe(1);
    expect(analysisWorkerCount(2, undefined)).toBe(1);
    expect(analysisWorkerCount(4, undefined)).toBe(3);
    expect(analysisWorkerCount(32, undefined)).toBe(4);
    expect(analysisWorkerCount(availableParallelism(), "0")).toBe(0);
    expect(analysisWorkerCount(2, "3")).toBe(3);
    expect(analysisQueueLimit(undefined)).toBe(8);
    expect(analysisQueueLimit("2")).toBe(2);
  });
});
