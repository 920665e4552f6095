"use client";
// Keeps the store's live figures in step with the layout on screen: a coarse analysis for every draft
// while a handle is dragged, the full one (and the neck trade-off) in the worker when the document changes.
//
// The coarse one is answered on this thread. Pointer input is dispatched at the start of a frame, and a
// worker's reply is a task that runs after that frame has painted, so readouts from the worker always trail
// the pointer by a frame; the coarse grid costs a fraction of a millisecond, well inside a frame. Should
// OVER_BUDGET_RUNS answers in a row take longer than COARSE_HERE_BUDGET_MS (a slow machine; the first
// ones also pay for warming the code up), the drafts go to the worker from then on.
import { useEffect } from "react";
import type { EditorStore } from "../store/editor-store";
import { createAnalysisClient, startAnalysisPort } from "./analysis-client";

const COARSE_HERE_BUDGET_MS = 4;
const OVER_BUDGET_RUNS = 5;

export function useLiveAnalysis(store: EditorStore): void {
  useEffect(() => {
    const { port, stop } = startAnalysisPort();
    const client = createAnalysisClient(port, (reply, isLatest) => {
      const set = store.getState().setLive;
      if (reply.ok) {
        // A coarse reply carries no trade-off: the last full one stays until the next full analysis.
        set({ analysis: reply.analysis, quality: reply.quality, stale: !isLatest, fault: null, ...(reply.tradeoff ? { tradeoff: reply.tradeoff } : {}) });
      }
      else if (isLatest) set({ stale: true, fault: reply.fault });
    });
    // The server's figures are of the saved layout; anything else on screen needs its own (and the
    // trade-off, which only the worker computes unless the page brought one).
    const first = store.getState();
    if (first.live.analysis === null || first.live.fault !== null || first.live.tradeoff === null) client.request(first.layout, "full");
    let overBudget = 0;
    const unsubscribe = store.subscribe((s, prev) => {
      if (s.draft && s.draft !== prev.draft) {
        if (overBudget >= OVER_BUDGET_RUNS) client.request(s.draft, "coarse");
        else overBudget = client.answerHere(s.draft, "coarse").ms > COARSE_HERE_BUDGET_MS ? overBudget + 1 : 0;
      }
      else if (!s.draft && (s.layout !== prev.layout || prev.draft)) client.request(s.layout, "full");
    });
    return () => {
      unsubscribe();
      client.close();
      stop();
    };
  }, [store]);
}
