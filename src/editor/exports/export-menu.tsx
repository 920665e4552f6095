"use client";
// The toolbar's exports: the dimension sheet (paper and orientation), the views for CAD, the sweeps as CSV
// and each view as SVG, all of the kit's saved version (or of the earlier revision shown), in the
// designer's unit. While a file is made the bar shows its progress (the shared export job), with a way
// to stop it; then what was saved, or why not.
import { useRef } from "react";
import { Button } from "@/components/ui/button";
import type { ExportFile } from "@/contracts/exports";
import { lengthUnitLabel } from "@/figures/length-unit";
import { useKitLibrary } from "../library/library-context";
import { selectDirty } from "../store/editor-store";
import { useEditor } from "../store/editor-context";
import { ExportJobStatus, useExportJob } from "./export-job";
import { SheetChoiceFields, sheetParams, useSheetChoices } from "./sheet-choices";

const OTHER_FILES: readonly { file: ExportFile; label: string }[] = [
  { file: "views.dxf", label: "Views for CAD (DXF, 1:1 mm)" },
  { file: "envelope.csv", label: "Steer × travel envelope (CSV)" },
  { file: "travel.csv", label: "Travel sweep (CSV)" },
  { file: "front.svg", label: "Front view (SVG)" },
  { file: "top.svg", label: "Top view (SVG)" },
  { file: "joint.svg", label: "Joint section (SVG)" },
];

const MAKING: Record<string, string> = { "sheet.pdf": "Making the dimension sheet…" };

export function ExportMenu() {
  const kit = useEditor((s) => s.kit);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const dirty = useEditor(selectDirty);
  // An earlier revision shown read-only is the one exported (`?revision=n`); else the saved head.
  const pinned = useKitLibrary()?.viewing?.revision ?? null;
  const [choices, setChoices] = useSheetChoices(unit);
  const exportJob = useExportJob();
  const details = useRef<HTMLDetailsElement>(null);

  const run = (file: ExportFile, query: Record<string, string>) => {
    details.current?.removeAttribute("open");
    // The DXF is always 1:1 in millimetres; every other file shows lengths in the designer's unit.
    const params = new URLSearchParams({ ...(file === "views.dxf" ? {} : { unit }), ...query, ...(pinned ? { revision: String(pinned) } : {}) });
    void exportJob.start({
      url: `/api/workspaces/${kit.workspaceId}/kits/${kit.kitId}/exports/${file}?${params}`,
      label: MAKING[file] ?? `Making ${file}…`,
      fallbackName: file,
      saved: (name) => `Saved ${name} (${pinned ? `revision ${pinned}` : `version ${kit.version}`}).`,
    });
  };

  const busy = exportJob.busy;
  return (
    <div className="flex items-center gap-2">
      <details ref={details} className="relative">
        <summary className="cursor-pointer rounded-md border border-ink/20 px-2 py-1 text-xs" data-testid="export-menu">Export…</summary>
        <div className="absolute right-0 z-20 mt-1 flex w-72 flex-col gap-2 rounded-md border border-ink/20 bg-white p-2 text-xs shadow-lg">
          <p className="text-ink-muted">
            {pinned ? `Of revision ${pinned}, as shown` : `Of the saved version ${kit.version}`}, lengths in {lengthUnitLabel(unit)}.{dirty && !pinned ? " Save first to include your changes." : ""}
          </p>
          <fieldset className="flex flex-col gap-1.5 border-t border-ink/10 pt-2">
            <legend className="font-semibold">Dimension sheet (PDF)</legend>
            <SheetChoiceFields value={choices} onChange={setChoices} />
            <Button data-testid="export-sheet" disabled={busy} onClick={() => run("sheet.pdf", sheetParams({ ...choices, unit }))}>Make the sheet</Button>
          </fieldset>
          <div className="flex flex-col gap-1 border-t border-ink/10 pt-2" role="group" aria-label="Other files">
            {OTHER_FILES.map((f) => (
              <Button key={f.file} variant="ghost" className="justify-start text-xs" disabled={busy} data-testid={`export-${f.file}`} onClick={() => run(f.file, {})}>
                {f.label}
              </Button>
            ))}
          </div>
        </div>
      </details>
      <ExportJobStatus state={exportJob} />
    </div>
  );
}
