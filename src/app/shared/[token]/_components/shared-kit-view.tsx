"use client";
// The shared page: the editor's views, readouts and plots, read-only, with the downloads and (when the link
// allows them) the comments as side tabs. Nothing here can change the kit: the store is read-only, no
// editing toolbar or properties panel is mounted, and the only write it sends is a comment.
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import type { ExportFile } from "@/contracts/exports";
import type { Layout } from "@/contracts/layout";
import type { SharedKit } from "@/contracts/sharing";
import type { AnalysisResult } from "@/engine";
import { CommentsPanel } from "@/editor/comments/comments-panel";
import { CommentsProvider, type CommentSource } from "@/editor/comments/comments-context";
import { downloadExport, type ExportProgress } from "@/editor/exports/fetch-export";
import { EditorProvider, useEditor, useEditorStore } from "@/editor/store/editor-context";
import { EditorWorkbench } from "@/editor/workbench/editor-workbench";
import { isLengthUnit } from "@/figures/length-unit";
import { queryKeys } from "@/lib/query-keys";

type Shown = Omit<SharedKit, "layout">;

const when = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

const FILES: readonly { file: ExportFile; label: string }[] = [
  { file: "sheet.pdf", label: "Dimension sheet (PDF, A4)" },
  { file: "views.dxf", label: "Views for CAD (DXF, 1:1 mm)" },
  { file: "envelope.csv", label: "Steer × travel envelope (CSV)" },
  { file: "travel.csv", label: "Travel sweep (CSV)" },
  { file: "front.svg", label: "Front view (SVG)" },
  { file: "top.svg", label: "Top view (SVG)" },
  { file: "joint.svg", label: "Joint section (SVG)" },
];

function SharedHeader({ shared }: { shared: Shown }) {
  const store = useEditorStore();
  const unit = useEditor((s) => s.settings.lengthUnit);
  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1 border-b border-ink/10 bg-white px-3 py-1.5">
      <div className="mr-auto min-w-0">
        <h1 className="truncate text-base font-semibold leading-tight" data-testid="shared-kit-name">{shared.kitName}</h1>
        <p className="text-xs text-ink-muted" data-testid="shared-kit-meta">
          {shared.scale} · revision {shared.revision}{shared.pinned ? "" : " (the latest)"} · from {shared.workspaceName}
          {shared.expiresAt ? ` · link expires ${when.format(new Date(shared.expiresAt))}` : ""}
        </p>
      </div>
      <span data-testid="read-only-badge" className="rounded bg-ink/10 px-1.5 py-0.5 text-xs font-medium text-ink">Shared read-only</span>
      <label className="flex items-center gap-1 text-xs">
        Units
        {/* Only how this page shows lengths: nothing is stored. */}
        <select value={unit} onChange={(e) => isLengthUnit(e.target.value) && store.getState().setSettings({ lengthUnit: e.target.value })} className="rounded border border-ink/20 bg-white px-1 py-1 text-xs">
          <option value="mm">millimetres</option>
          <option value="in">inches</option>
        </select>
      </label>
    </div>
  );
}

function Downloads({ token }: { token: string }) {
  const unit = useEditor((s) => s.settings.lengthUnit);
  const [job, setJob] = useState<{ file: ExportFile; progress: ExportProgress } | null>(null);
  const [outcome, setOutcome] = useState<{ ok: boolean; text: string } | null>(null);
  const run = async (file: ExportFile) => {
    if (job) return;
    setOutcome(null);
    setJob({ file, progress: { phase: "making" } });
    const query = file === "views.dxf" ? "" : `?unit=${unit}`;
    try {
      const name = await downloadExport(`/api/share/${token}/exports/${file}${query}`, file, (progress) => setJob({ file, progress }), new AbortController().signal);
      setOutcome({ ok: true, text: `Saved ${name}.` });
    } catch (error) {
      setOutcome({ ok: false, text: `Not downloaded: ${(error as Error).message}` });
    } finally {
      setJob(null);
    }
  };
  const fraction = job?.progress.phase === "receiving" ? job.progress.fraction : null;
  return (
    <section aria-label="Downloads" className="flex flex-col gap-2" data-testid="shared-downloads">
      <h2 className="text-sm font-semibold">Downloads of this revision</h2>
      <p className="text-xs text-ink-muted">Lengths in the unit chosen above; the DXF is always 1:1 in millimetres.</p>
      <ul className="flex flex-col gap-1">
        {FILES.map((f) => (
          <li key={f.file}>
            <Button variant="secondary" className="w-full justify-start px-2 py-1 text-xs" disabled={job !== null} data-testid={`shared-download-${f.file}`} onClick={() => void run(f.file)}>{f.label}</Button>
          </li>
        ))}
      </ul>
      <div role="status" aria-live="polite" className="text-xs" data-testid="shared-download-status">
        {job ? (
          <span className="flex items-center gap-1.5">
            {job.file === "sheet.pdf" ? "Making the dimension sheet…" : `Making ${job.file}…`}
            <progress aria-label={`Making ${job.file}`} className="h-1.5 w-20" max={1} value={fraction ?? undefined} />
          </span>
        ) : outcome ? (
          <span className={outcome.ok ? "text-ink-muted" : "text-red-700"}>{outcome.text}</span>
        ) : null}
      </div>
    </section>
  );
}

export function SharedKitView({ token, shared, layout, analysis }: { token: string; shared: Shown; layout: Layout; analysis: AnalysisResult | null }) {
  const comments = useMemo<CommentSource>(() => ({ key: queryKeys.sharedComments(token), listUrl: `/api/share/${token}/comments`, itemUrl: null, needsName: true }), [token]);
  const tabs = useMemo(
    () => [
      { id: "downloads", label: "Downloads", content: () => <Downloads token={token} /> },
      ...(shared.allowComments ? [{ id: "comments", label: "Comments", content: () => <CommentsPanel /> }] : []),
    ],
    [token, shared.allowComments],
  );
  const init = {
    kit: { workspaceId: "", kitId: "", name: shared.kitName, scale: shared.scale, notes: "", version: 0, updatedByName: null, updatedAt: "", headRevision: shared.revision },
    layout,
    readOnly: true,
    lengthUnit: "mm" as const,
    analysis,
  };
  const workbench = <EditorWorkbench header={<SharedHeader shared={shared} />} properties={false} sideTabs={tabs} />;
  return (
    <EditorProvider init={init}>
      {shared.allowComments ? <CommentsProvider source={comments} revision={shared.revision}>{workbench}</CommentsProvider> : workbench}
    </EditorProvider>
  );
}
