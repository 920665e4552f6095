"use client";
// The toolbar's exports: the dimension sheet (paper and orientation), the views for CAD, the sweeps as CSV
// and each view as SVG, all of the kit's saved version, in the designer's unit. While a file is made the
// bar shows its progress, with a way to stop it; then what was saved, or why not.
import { useId, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import type { ExportFile, Orientation, PaperSize } from "@/contracts/exports";
import { lengthUnitLabel } from "@/figures/length-unit";
import { selectDirty } from "../store/editor-store";
import { useEditor } from "../store/editor-context";
import { downloadExport, type ExportProgress } from "./fetch-export";

const OTHER_FILES: readonly { file: ExportFile; label: string }[] = [
  { file: "views.dxf", label: "Views for CAD (DXF, 1:1 mm)" },
  { file: "envelope.csv", label: "Steer × travel envelope (CSV)" },
  { file: "travel.csv", label: "Travel sweep (CSV)" },
  { file: "front.svg", label: "Front view (SVG)" },
  { file: "top.svg", label: "Top view (SVG)" },
  { file: "joint.svg", label: "Joint section (SVG)" },
];

const MAKING: Record<string, string> = { "sheet.pdf": "Making the dimension sheet…" };

type Job = { readonly label: string; readonly progress: ExportProgress; readonly abort: AbortController };
type Outcome = { readonly ok: boolean; readonly text: string };

export function ExportMenu() {
  const kit = useEditor((s) => s.kit);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const dirty = useEditor(selectDirty);
  const [paper, setPaper] = useState<PaperSize>(unit === "in" ? "letter" : "a4");
  const [orientation, setOrientation] = useState<Orientation>("portrait");
  const [job, setJob] = useState<Job | null>(null);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const details = useRef<HTMLDetailsElement>(null);
  const paperId = useId();
  const orientationId = useId();

  const run = async (file: ExportFile, query: Record<string, string>) => {
    if (job) return;
    const abort = new AbortController();
    const label = MAKING[file] ?? `Making ${file}…`;
    setOutcome(null);
    setJob({ label, progress: { phase: "making" }, abort });
    details.current?.removeAttribute("open");
    // The DXF is always 1:1 in millimetres; every other file shows lengths in the designer's unit.
    const params = new URLSearchParams(file === "views.dxf" ? query : { unit, ...query });
    const url = `/api/workspaces/${kit.workspaceId}/kits/${kit.kitId}/exports/${file}?${params}`;
    try {
      const name = await downloadExport(url, file, (progress) => setJob((j) => (j ? { ...j, progress } : j)), abort.signal);
      setOutcome({ ok: true, text: `Saved ${name} (version ${kit.version}).` });
    } catch (error) {
      setOutcome((error as Error).name === "AbortError" ? { ok: false, text: "Export stopped." } : { ok: false, text: `Not exported: ${(error as Error).message}` });
    } finally {
      setJob(null);
    }
  };

  const fraction = job?.progress.phase === "receiving" ? job.progress.fraction : null;
  return (
    <div className="flex items-center gap-2">
      <details ref={details} className="relative">
        <summary className="cursor-pointer rounded-md border border-ink/20 px-2 py-1 text-xs" data-testid="export-menu">Export…</summary>
        <div className="absolute right-0 z-20 mt-1 flex w-72 flex-col gap-2 rounded-md border border-ink/20 bg-white p-2 text-xs shadow-lg">
          <p className="text-ink-muted">
            Of the saved version {kit.version}, lengths in {lengthUnitLabel(unit)}.{dirty ? " Save first to include your changes." : ""}
          </p>
          <fieldset className="flex flex-col gap-1.5 border-t border-ink/10 pt-2">
            <legend className="font-semibold">Dimension sheet (PDF)</legend>
            <div className="flex items-center gap-2">
              <label htmlFor={paperId}>Paper</label>
              <select id={paperId} value={paper} onChange={(e) => setPaper(e.target.value as PaperSize)} className="rounded border border-ink/20 bg-white px-1 py-0.5">
                <option value="a4">A4</option>
                <option value="letter">Letter</option>
              </select>
              <label htmlFor={orientationId}>Orientation</label>
              <select id={orientationId} value={orientation} onChange={(e) => setOrientation(e.target.value as Orientation)} className="rounded border border-ink/20 bg-white px-1 py-0.5">
                <option value="portrait">portrait</option>
                <option value="landscape">landscape</option>
              </select>
            </div>
            <Button data-testid="export-sheet" disabled={job !== null} onClick={() => run("sheet.pdf", { paper, orientation })}>Make the sheet</Button>
          </fieldset>
          <div className="flex flex-col gap-1 border-t border-ink/10 pt-2" role="group" aria-label="Other files">
            {OTHER_FILES.map((f) => (
              <Button key={f.file} variant="ghost" className="justify-start text-xs" disabled={job !== null} data-testid={`export-${f.file}`} onClick={() => run(f.file, {})}>
                {f.label}
              </Button>
            ))}
          </div>
        </div>
      </details>
      <div role="status" aria-live="polite" data-testid="export-status" className="flex items-center gap-1.5 text-xs">
        {job ? (
          <>
            <span>{job.label}</span>
            {/* No value while the server works (indeterminate), then the share received. */}
            <progress aria-label={job.label} className="h-1.5 w-20" max={1} value={fraction ?? undefined} />
            <button type="button" className="rounded px-1 text-steel underline" onClick={() => job.abort.abort()}>Stop</button>
          </>
        ) : outcome ? (
          <span className={outcome.ok ? "text-ink-muted" : "text-red-700"}>{outcome.text}</span>
        ) : null}
      </div>
    </div>
  );
}
