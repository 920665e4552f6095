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
import { CommentsPanel } from "@/editor/comments/comments-panel";
import { CommentsProvider, type CommentSource } from "@/editor/comments/comments-context";
import { ShareLinksPanel } from "@/editor/sharing/share-links-panel";
import { queryKeys } from "@/lib/query-keys";
import { useMemo } from "react";
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
  { id: "comments", label: "Comments", content: () => <CommentsPanel /> },
];
// Share links are the editors' to make: the tab is there for them only (the server checks the role too).
const EDITOR_TABS = [...SIDE_TABS, { id: "share", label: "Share", content: () => <ShareLinksPanel /> }];

export function KitEditor({ init, library, fromSearch = null }: { init: EditorInit; library: KitLibraryInit; fromSearch?: SearchResultOrigin | null }) {
  const { workspaceId, kitId } = init.kit;
  const comments = useMemo<CommentSource>(() => {
    const base = `/api/workspaces/${workspaceId}/kits/${kitId}/comments`;
    return { key: queryKeys.comments(workspaceId, kitId), listUrl: base, itemUrl: (id) => `${base}/${id}`, needsName: false };
  }, [workspaceId, kitId]);
  // Comments pin to the revision shown: an earlier one, or the head as the page opened it.
  const revision = library.viewing?.revision ?? init.kit.headRevision ?? 1;
  return (
    <EditorProvider init={init}>
      <KitLibraryProvider init={library}>
        {/* Reference pictures belong to the kit, not to a revision: the same under every revision shown. */}
        <UnderlayProvider workspaceId={init.kit.workspaceId} kitId={init.kit.kitId} canWrite={library.canWrite}>
          <CommentsProvider source={comments} revision={revision}>
            <div className="flex min-h-0 flex-1 flex-col">
              <RevisionBanner />
              <SearchResultBanner origin={fromSearch} />
              <EditorWorkbench sideTabs={library.canWrite ? EDITOR_TABS : SIDE_TABS} />
            </div>
          </CommentsProvider>
        </UnderlayProvider>
      </KitLibraryProvider>
    </EditorProvider>
  );
}
