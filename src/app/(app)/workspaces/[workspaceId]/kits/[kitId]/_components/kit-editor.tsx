"use client";
// The kit's page: the editor, with the full analysis sheet as one of its side tabs (fed by the live
// figures, so it follows every edit).
import type { EditorInit } from "@/editor/store/editor-store";
import { EditorProvider, useEditor } from "@/editor/store/editor-context";
import { EditorWorkbench } from "@/editor/workbench/editor-workbench";
import { AnalysisSheet } from "./analysis-sheet";
import { JointAngleChart, SteerLockChart, TravelChart } from "./kit-charts";

function LiveSheet() {
  const analysis = useEditor((s) => s.live.analysis);
  const stale = useEditor((s) => s.live.stale);
  return <AnalysisSheet analysis={analysis} stale={stale} />;
}

function Plots() {
  const a = useEditor((s) => s.live.analysis);
  if (!a) return <p className="p-3 text-sm text-ink-muted">The plots appear once the layout has been analysed.</p>;
  return (
    <div className="grid h-full grid-cols-3 gap-2 overflow-auto p-2">
      <TravelChart travel={a.travel} />
      <SteerLockChart perTravel={a.steerLock.perTravel} />
      <JointAngleChart steps={a.steering.steps} limitDeg={a.drive.jointLimitDeg} />
    </div>
  );
}

export function KitEditor({ init }: { init: EditorInit }) {
  return (
    <EditorProvider init={init}>
      <EditorWorkbench plots={<Plots />} sideTabs={[{ id: "sheet", label: "Sheet", content: () => <LiveSheet /> }]} />
    </EditorProvider>
  );
}
