import { act, renderHook, waitFor } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { analyzeLayout, neckTradeoff, NECK_TRADEOFF_GRID } from "@/engine";
import { setAt } from "@/figures/layout-paths";
import { createAnalysisClient, type AnalysisPort } from "@/editor/readouts/analysis-client";
import { ANALYSIS_GRIDS, answerAnalysisRequest, type AnalysisReply, type AnalysisRequest } from "@/editor/readouts/analysis-protocol";
import { useLiveAnalysis } from "@/editor/readouts/use-live-analysis";
import { makeStore } from "./editor-fixtures";

describe("the worker's answer", () => {
  it("is the engine's own analysis at the requested grid", () => {
    const reply = answerAnalysisRequest({ type: "analyze", id: 7, quality: "full", layout: TARNWICK_10_BASE });
    expect(reply.ok).toBe(true);
    if (!reply.ok) return;
    expect(reply.id).toBe(7);
    expect(reply.analysis).toEqual(analyzeLayout(TARNWICK_10_BASE, ANALYSIS_GRIDS.full));
    const coarse = answerAnalysisRequest({ type: "analyze", id: 8, quality: "coarse", layout: TARNWICK_10_BASE });
    expect(coarse.ok && coarse.analysis.grid).toEqual(ANALYSIS_GRIDS.coarse);
  });

  it("adds the neck trade-off to a full analysis, and only to a full one", () => {
    const full = answerAnalysisRequest({ type: "analyze", id: 9, quality: "full", layout: TARNWICK_10_BASE });
    if (!full.ok) throw new Error("the demo layout analyses");
    expect(full.tradeoff).toEqual(neckTradeoff(TARNWICK_10_BASE));
    // Its current-neck sample is the figures the readouts show at the same grid: 5 mm, the worst lock, the safety factor.
    const at = full.tradeoff!.samples[full.tradeoff!.currentIndex];
    const same = analyzeLayout(TARNWICK_10_BASE, NECK_TRADEOFF_GRID);
    expect(at).toMatchObject({ ok: true, neckDiameterMm: 5, steerLockDeg: same.steerLock.worst.innerDeg, safetyFactor: same.strength.safetyFactor });
    expect(full.tradeoff!.samples.length).toBeGreaterThanOrEqual(15);
    const coarse = answerAnalysisRequest({ type: "analyze", id: 10, quality: "coarse", layout: TARNWICK_10_BASE });
    expect(coarse.ok && coarse.tradeoff).toBeNull();
  });

  it("names the field for a value out of its range", () => {
    const reply = answerAnalysisRequest({ type: "analyze", id: 1, quality: "full", layout: setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", -2) });
    expect(reply.ok).toBe(false);
    if (reply.ok) return;
    expect(reply.fault).toMatchObject({ kind: "invalid", path: "drive.neckDiameterMm", part: "neck" });
    // In the panel's words, not the contract's dotted path.
    expect(reply.fault.message).toBe("Neck diameter must be at least 0.3 mm");
  });

  it("calls a neck wider than the mouth impossible, on the neck", () => {
    const reply = answerAnalysisRequest({ type: "analyze", id: 1, quality: "full", layout: setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 9) });
    expect(!reply.ok && reply.fault).toMatchObject({ kind: "impossible", part: "neck", path: "drive.neckDiameterMm", message: "Neck diameter must be smaller than cup mouth diameter" });
  });

  it("calls arms that cannot close impossible, naming the part", () => {
    // The upper arm pulled far inboard: the upright cannot reach full bump.
    const layout = setAt(setAt(TARNWICK_10_BASE, "frontView.upperInner.y", 100), "frontView.upperInner.z", 51);
    const reply = answerAnalysisRequest({ type: "analyze", id: 1, quality: "full", layout });
    expect(reply.ok).toBe(false);
    if (reply.ok) return;
    expect(reply.fault.kind).toBe("impossible");
    expect(reply.fault.part).not.toBeNull();
    expect(reply.fault.message).toMatch(/^(front suspension|tie rod|upright|upper arm)/);
  });

  it("marks a point dragged inboard of its partner on that point's handle", () => {
    const reply = answerAnalysisRequest({ type: "analyze", id: 1, quality: "coarse", layout: setAt(TARNWICK_10_BASE, "frontView.lowerOuter.y", 20) });
    expect(!reply.ok && reply.fault).toMatchObject({ kind: "impossible", handleId: "front:lowerOuter", part: "lowerArm" });
  });
});

/** The worker's side over a real MessageChannel: the transport differs from a Worker, the protocol does not. */
function workerOverChannel() {
  const channel = new MessageChannel();
  const seen: number[] = [];
  channel.port2.onmessage = (e: MessageEvent<AnalysisRequest>) => {
    seen.push(e.data.id);
    channel.port2.postMessage(answerAnalysisRequest(e.data));
  };
  return { port: channel.port1 as unknown as AnalysisPort, seen, close: () => { channel.port1.close(); channel.port2.close(); } };
}

describe("the client's protocol", () => {
  it("keeps one request in flight and only the newest waiting one; replies arrive in order", async () => {
    const w = workerOverChannel();
    const replies: { reply: AnalysisReply; latest: boolean }[] = [];
    const done = new Promise<void>((resolve) => {
      const client = createAnalysisClient(w.port, (reply, latest) => {
        replies.push({ reply, latest });
        if (latest) resolve();
      });
      for (let i = 0; i < 10; i++) client.request(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 5 - i * 0.1), "coarse");
      expect(client.droppedCount()).toBe(8);
    });
    await done;
    // The first went at once; of the nine that queued behind it only the last survived.
    expect(w.seen).toEqual([1, 10]);
    expect(replies.map((r) => r.reply.id)).toEqual([1, 10]);
    expect(replies.map((r) => r.latest)).toEqual([false, true]);
    const last = replies[1]!.reply;
    expect(last.ok && last.analysis.strength.safetyFactor).toBeCloseTo(analyzeLayout(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 4.1), ANALYSIS_GRIDS.coarse).strength.safetyFactor, 10);
    w.close();
  });
});

describe("answering on this thread", () => {
  it("is the newest answer: a waiting request is dropped and an older worker reply never overwrites it", async () => {
    const w = workerOverChannel();
    const sfAt = (neckMm: number) => analyzeLayout(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", neckMm), ANALYSIS_GRIDS.coarse).strength.safetyFactor;
    const delivered: { id: number; latest: boolean; sf: number }[] = [];
    const client = createAnalysisClient(w.port, (reply, latest) => {
      if (reply.ok) delivered.push({ id: reply.id, latest, sf: reply.analysis.strength.safetyFactor });
    });
    client.request(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 4.8), "full"); // id 1, in flight
    client.request(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 4.6), "full"); // id 2, waiting
    const here = client.answerHere(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 4.2), "coarse"); // id 3
    expect(here.ok && here.id).toBe(3);
    expect(client.droppedCount()).toBe(1);
    expect(delivered).toEqual([{ id: 3, latest: true, sf: sfAt(4.2) }]);
    // The worker's reply to request 1 arrives after: it is older than what is shown, so it is not delivered.
    await new Promise((r) => setTimeout(r, 50));
    expect(w.seen).toEqual([1]);
    expect(delivered.map((d) => d.id)).toEqual([3]);
    // A newer worker request is delivered again.
    client.request(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 4.0), "full");
    await waitFor(() => expect(delivered.map((d) => d.id)).toEqual([3, 4]));
    expect(delivered[1]).toEqual({ id: 4, latest: true, sf: sfAt(4.0) });
    w.close();
  });
});

describe("the live analysis hook", () => {
  it("fills the store's trade-off from the full analysis and keeps it through coarse drafts", async () => {
    // jsdom has no Worker: the port answers on this thread, through the same protocol.
    const store = makeStore({ analysis: analyzeLayout(TARNWICK_10_BASE, ANALYSIS_GRIDS.full) });
    expect(store.getState().live.tradeoff).toBeNull();
    const hook = renderHook(() => useLiveAnalysis(store));
    await waitFor(() => expect(store.getState().live.tradeoff).not.toBeNull());
    const first = store.getState().live.tradeoff!;
    expect(first).toEqual(neckTradeoff(TARNWICK_10_BASE));

    const seq = store.getState().live.seq;
    act(() => store.getState().setDraft(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 4.5)));
    // A draft's coarse figures are there as soon as the draft is (answered on this thread, in step with the pointer).
    expect(store.getState().live.seq).toBe(seq + 1);
    expect(store.getState().live.quality).toBe("coarse");
    expect(store.getState().live.analysis?.strength.safetyFactor).toBe(analyzeLayout(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 4.5), ANALYSIS_GRIDS.coarse).strength.safetyFactor);
    expect(store.getState().live.tradeoff).toBe(first);

    act(() => store.getState().commit(setAt(TARNWICK_10_BASE, "drive.neckDiameterMm", 4.5)));
    await waitFor(() => expect(store.getState().live.tradeoff?.currentNeckMm).toBe(4.5));
    expect(store.getState().live.quality).toBe("full");
    hook.unmount();
  });
});
