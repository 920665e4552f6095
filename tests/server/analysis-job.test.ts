import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import { analyzeLayout } from "@/engine";
import { runAnalysisJob } from "@/server/analysis/analysis-job";

// The job is what a worker thread runs; inline it must give exactly the engine's answer.
describe("analysis job", () => {
  it("serialises the engine's result with the envelope fields around it", () => {
    const out = runAnalysisJob({ layout: TARNWICK_10_THIN_NECK, grid: { travelSteps: 5, steerSteps: 9 }, envelope: { kitId: "k1", version: 3 } });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const parsed = JSON.parse(out.json);
    expect(parsed.kitId).toBe("k1");
    expect(parsed.version).toBe(3);
    expect(parsed.analysis).toEqual(JSON.parse(JSON.stringify(analyzeLayout(TARNWICK_10_THIN_NECK, { travelSteps: 5, steerSteps: 9 }))));
  });

  it("answers a bad layout with the field paths under layout.", () => {
    const out = runAnalysisJob({ layout: { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, wheelbaseMm: -3 } } });
    expect(out).toMatchObject({ ok: false, status: 422, code: "invalid" });
    if (out.ok) return;
    expect(out.fields?.[0]?.path).toBe("layout.topView.wheelbaseMm");
  });

  it("answers impossible geometry with the part and the reason", () => {
    const out = runAnalysisJob({ layout: { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: 8.5 } } });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.status).toBe(422);
    expect(`${out.message} ${out.part ?? ""}`).toMatch(/neck/i);
  });
});
