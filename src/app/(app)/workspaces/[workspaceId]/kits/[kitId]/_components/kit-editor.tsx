"use client";
// The kit's page: the editor, with the full analysis sheet, the history, the kit's details and targets, the
// shelf and the test log as side tabs (fed by the live figures, so they follow every edit). An earlier revision opens
// read-only under a banner that says so.
import type { EditorInit } from "@/editor/store/editor-store";
import { EditorProvider, useEditor } from "@/editor/store/editor-context";
import { HistoryPanel } from "@/editor/library/history-panel";
import { KitDetailsPanel } from "@/editor/library/kit-details-panel";
import { KitLibraryProvider, type KitLibraryInit } from "@/editor/library/library-context";
import { RevisionBanner } from "@/editor/library/revision-banner";
import { SearchResultBanner, type SearchResultOrigin } from "@/editor/library/search-result-banner";
import { ShelfTab } from "@/editor/library/shelf-tab";
import { TestLogTab } from "@/editor/test-log/test-log-tab";
import { UnderlayProvider } from "@/editor/underlay/underlay-context";
import { EditorWorkbench } from "@/editor/workbench/editor-workbench";
import { AnalysisSheet } from "./analysis-sheet";

function LiveSheet() {
  const analysis = useEditor((s) => s.live.analysis);
  const stale = useEditor((s) => s.live.stale);
  const unit = useEditor((s) => s.settings.lengthUnit);
  return <AnalysisSheet analysis={analysis} stale={stale} lengthUnit={unit} />;
}

const SIDE_TABS = [
  { id: "sheet", label: "Sheet", content: () => <LiveSheet /> },
  { id: "history", label: "History", content: () => <HistoryPanel /> },
  { id: "kit", label: "Kit & targets", content: () => <KitDetailsPanel /> },
  { id: "shelf", label: "Shelf", content: () => <ShelfTab /> },
  { id: "test-log", label: "Test log", content: () => <TestLogTab /> },
];

export function KitEditor({ init, library, fromSearch = null }: { init: EditorInit; library: KitLibraryInit; fromSearch?: SearchResultOrigin | null }) {
  return (
    <EditorProvider init={init}>
      <KitLibraryProvider init={library}>
        {/* Reference pictures belong to the kit, not to a revision: the same under every revision shown. */}
        <UnderlayProvider workspaceId={init.kit.workspaceId} kitId={init.kit.kitId} canWrite={library.canWrite}>
          <div className="flex min-h-0 flex-1 flex-col">
            <RevisionBanner />
            <SearchResultBanner origin={fromSearch} />
            <EditorWorkbench sideTabs={SIDE_TABS} />
          </div>
        </UnderlayProvider>
      </KitLibraryProvider>
    </EditorProvider>
  );
}
