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
      if (reply.ok) set({ analysis: reply.analysis, quality: reply.quality, stale: !isLatest, fault: null });
      else if (isLatest) set({ stale: true, fault: reply.fault });
    });
    // The server's figures are of the saved layout; anything else on screen needs its own.
    const first = store.getState();
    if (first.live.analysis === null || first.live.fault !== null) client.request(first.layout, "full");
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
