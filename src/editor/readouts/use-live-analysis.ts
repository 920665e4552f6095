"use client";
// Keeps the store's live figures in step with the layout on screen: a coarse analysis for every draft
// while a handle is dragged, the full one when the document changes.
import { useEffect } from "react";
import type { EditorStore } from "../store/editor-store";
import { createAnalysisClient, startAnalysisPort } from "./analysis-client";

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
    const unsubscribe = store.subscribe((s, prev) => {
      if (s.draft && s.draft !== prev.draft) client.request(s.draft, "coarse");
      else if (!s.draft && (s.layout !== prev.layout || prev.draft)) client.request(s.layout, "full");
    });
    return () => {
      unsubscribe();
      client.close();
      stop();
    };
  }, [store]);
}
