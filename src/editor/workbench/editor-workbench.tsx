"use client";
// The whole editor: toolbar and motion preview on top; the three views side by side above the plots, all
// resizable; readouts and properties (and whatever the page adds) in tabs on the right.
import { useCallback, type ReactNode } from "react";
import { Group, Panel, Separator } from "react-resizable-panels";
import { FrontViewLoaded, JointSectionViewLoaded, TopViewLoaded } from "../canvas/views-loader";
import { useEditorShortcuts } from "../keyboard/use-editor-shortcuts";
import { PropertyPanel } from "../panel/property-panel";
import { EditorPlots } from "../plots/editor-plots";
import { PreviewControls } from "../preview/preview-controls";
import { ReadoutsPanel } from "../readouts/readouts-panel";
import { useLiveAnalysis } from "../readouts/use-live-analysis";
import { ConflictDialog } from "../save/conflict-dialog";
import { LeaveGuard } from "../save/leave-guard";
import { saveLayout } from "../save/save-actions";
import { selectCanSave } from "../store/editor-store";
import { useEditorStore } from "../store/editor-context";
import { EditorToolbar } from "../toolbar/editor-toolbar";
import { TabSet, type TabDef } from "./tab-set";

function Handle({ label, orientation }: { label: string; orientation: "horizontal" | "vertical" }) {
  const bar = orientation === "horizontal" ? "w-1.5 cursor-col-resize" : "h-1.5 cursor-row-resize";
  return <Separator aria-label={label} className={`${bar} shrink-0 rounded bg-transparent hover:bg-steel/30 focus-visible:bg-steel/50 focus-visible:outline-none data-[separator=active]:bg-steel/50`} />;
}

/**
 * `header` replaces the editing toolbar and `properties={false}` leaves out the properties tab: the shared
 * page shows the drawing, readouts and plots with no edit control.
 */
export function EditorWorkbench({ plots = <EditorPlots />, sideTabs = [], header, properties = true }: { plots?: ReactNode; sideTabs?: readonly TabDef[]; header?: ReactNode; properties?: boolean }) {
  const store = useEditorStore();
  useLiveAnalysis(store);
  const save = useCallback(() => {
    if (selectCanSave(store.getState())) void saveLayout(store);
  }, [store]);
  useEditorShortcuts(store, save);

  const tabs: TabDef[] = [
    { id: "readouts", label: "Readouts", content: () => <ReadoutsPanel /> },
    ...(properties ? [{ id: "properties", label: "Properties", content: () => <PropertyPanel /> }] : []),
    ...sideTabs,
  ];

  return (
    <div data-editor className="flex min-h-0 flex-1 flex-col bg-paper">
      {header ?? <EditorToolbar onSave={save} />}
      <PreviewControls />
      <Group orientation="horizontal" className="min-h-0 flex-1 p-1.5">
        <Panel id="drawings" defaultSize="68" minSize="40">
          <Group orientation="vertical" className="h-full">
            <Panel id="views" defaultSize="62" minSize="25">
              <Group orientation="horizontal" className="h-full">
                <Panel id="front" defaultSize="38" minSize="15"><FrontViewLoaded /></Panel>
                <Handle label="Resize the front and top views" orientation="horizontal" />
                <Panel id="top" defaultSize="37" minSize="15"><TopViewLoaded /></Panel>
                <Handle label="Resize the top view and the joint section" orientation="horizontal" />
                <Panel id="joint" defaultSize="25" minSize="12"><JointSectionViewLoaded /></Panel>
              </Group>
            </Panel>
            <Handle label="Resize the views and the plots" orientation="vertical" />
            <Panel id="plots" defaultSize="38" minSize="15">
              <div data-testid="editor-plots-area" className="h-full overflow-hidden rounded-md border border-ink/15 bg-white">{plots}</div>
            </Panel>
          </Group>
        </Panel>
        <Handle label="Resize the drawings and the side panel" orientation="horizontal" />
        <Panel id="side" defaultSize="32" minSize="22">
          <div data-testid="editor-side" className="h-full"><TabSet label="Figures and properties" tabs={tabs} className="h-full rounded-md border border-ink/15 bg-white" /></div>
        </Panel>
      </Group>
      <ConflictDialog />
      <LeaveGuard />
    </div>
  );
}
