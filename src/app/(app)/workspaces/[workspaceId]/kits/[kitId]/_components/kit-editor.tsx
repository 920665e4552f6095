"use client";
// The kit's page: the editor, with the full analysis sheet as one of its side tabs (fed by the live
// figures, so it follows every edit).
import type { EditorInit } from "@/editor/store/editor-store";
import { EditorProvider, useEditor } from "@/editor/store/editor-context";
import { EditorWorkbench } from "@/editor/workbench/editor-workbench";
import { AnalysisSheet } from "./analysis-sheet";

function LiveSheet() {
  const analysis = useEditor((s) => s.live.analysis);
  const stale = useEditor((s) => s.live.stale);
  const unit = useEditor((s) => s.settings.lengthUnit);
  return <AnalysisSheet analysis={analysis} stale={stale} lengthUnit={unit} />;
}

export function KitEditor({ init }: { init: EditorInit }) {
  return (
    <EditorProvider init={init}>
      <EditorWorkbench sideTabs={[{ id: "sheet", label: "Sheet", content: () => <LiveSheet /> }]} />
    </EditorProvider>
  );
}
