"use client";
// The plots under the drawings, one tab each, all fed by the live figures. Picking a neck on the
// trade-off writes it to the layout as one undo step (the panel and the drawings follow the store).
import { memo, useCallback, useDeferredValue } from "react";
import { setNeckDiameter } from "../commands/edit-commands";
import { useEditor, useEditorHeldWhileDragging, useEditorStore } from "../store/editor-context";
import type { EditorState } from "../store/editor-store";
import { TabSet } from "../workbench/tab-set";
import { AckermannPlot } from "./ackermann-plot";
import { JointEnvelopeMap } from "./joint-envelope-map";
import { NeckTradeoffPlot } from "./neck-tradeoff-plot";
import { TravelPlot } from "./travel-plot";

// While a handle is dragged the plots hold the figures they had (the readouts and the drawings follow the
// pointer; redrawing every chart per move costs more than a frame), and take the layout's figures on
// release, at low priority (useDeferredValue). Memoised, so a render with unchanged figures costs nothing.
const Travel = memo(TravelPlot);
const Envelope = memo(JointEnvelopeMap);
const Ackermann = memo(AckermannPlot);

const selectAnalysis = (s: EditorState) => s.live.analysis;
const selectStale = (s: EditorState) => s.live.stale;

function useDeferredLive() {
  const analysis = useDeferredValue(useEditorHeldWhileDragging(selectAnalysis));
  const held = useEditorHeldWhileDragging(selectStale);
  // Marked stale while held: the figures are of the layout before the drag.
  const stale = useDeferredValue(useEditor((s) => s.draft !== null) || held);
  return { analysis, stale };
}

function LiveTravelPlot() {
  const { analysis, stale } = useDeferredLive();
  const unit = useEditor((s) => s.settings.lengthUnit);
  return <Travel analysis={analysis} lengthUnit={unit} stale={stale} />;
}

function LiveEnvelopeMap() {
  const { analysis, stale } = useDeferredLive();
  const unit = useEditor((s) => s.settings.lengthUnit);
  return <Envelope analysis={analysis} lengthUnit={unit} stale={stale} />;
}

function LiveAckermannPlot() {
  const { analysis, stale } = useDeferredLive();
  return <Ackermann analysis={analysis} stale={stale} />;
}

function LiveNeckTradeoff() {
  const store = useEditorStore();
  const tradeoff = useEditor((s) => s.live.tradeoff);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const readOnly = useEditor((s) => s.readOnly);
  const dragging = useEditor((s) => s.draft !== null);
  const layoutNeck = useEditor((s) => s.layout.drive.neckDiameterMm);
  // The trade-off comes from full analyses only: while a drag or a newer edit computes, it is of an earlier layout.
  const stale = useEditor((s) => s.live.stale || s.live.quality !== "full") || dragging || (tradeoff !== null && tradeoff.currentNeckMm !== layoutNeck);
  const pick = useCallback(
    (mm: number) => {
      const s = store.getState();
      if (s.readOnly) return;
      s.commit(setNeckDiameter(s.layout, mm));
    },
    [store],
  );
  return (
    <NeckTradeoffPlot tradeoff={tradeoff} lengthUnit={unit} onPickNeck={pick} stale={stale}
      staleNote={stale ? "working out the trade-off of the layout on screen" : undefined}
      pickDisabled={readOnly} pickDisabledNote="You can read this kit but not change it: picking a neck is off." />
  );
}

export function EditorPlots() {
  return (
    <TabSet label="Plots" className="h-full" tabs={[
      { id: "plot-tab-travel", label: "Camber and roll centre", content: () => <LiveTravelPlot /> },
      { id: "plot-tab-envelope", label: "Joint envelope", content: () => <LiveEnvelopeMap /> },
      { id: "plot-tab-ackermann", label: "Ackermann", content: () => <LiveAckermannPlot /> },
      { id: "plot-tab-neck", label: "Neck trade-off", content: () => <LiveNeckTradeoff /> },
    ]} />
  );
}
