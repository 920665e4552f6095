"use client";
// The editor's top bar: what is open and whether it is saved, undo and redo, the grid step and the unit,
// what the views draw, the exports, and Save. Viewers see the same bar without any control that writes.
import { useId } from "react";
import { Button } from "@/components/ui/button";
import { api } from "@/lib/api-client";
import { ExportMenu } from "../exports/export-menu";
import { selectDirty, selectFaulty, redo, undo, type ShowOptions } from "../store/editor-store";
import { useEditor, useEditorStore, useHistoryDepth } from "../store/editor-context";
import { GRID_STEPS_MM } from "../tools/snapping";
import { formatLength, isLengthUnit, type LengthUnit } from "@/figures/length-unit";

// How tooltips name the shortcuts' modifier: one text for every platform, so server and browser render alike.
const SHORTCUT_MOD = "Ctrl/⌘";

const SHOW_LABELS: Record<keyof ShowOptions, string> = {
  kingpinAxis: "Kingpin axis and ground point",
  instantCentre: "Instant centre",
  rollCentre: "Roll centre",
  ackermann: "Turning lines (Ackermann)",
  dimensions: "Dimension labels",
};

function SaveStatus() {
  const save = useEditor((s) => s.save);
  const dirty = useEditor(selectDirty);
  let text = dirty ? "Unsaved changes" : "All changes saved";
  if (save.status === "saving") text = "Saving…";
  else if (save.status === "error") text = `Not saved: ${save.message}`;
  else if (save.status === "conflict") text = "Not saved: someone else saved first";
  const tone = save.status === "error" || save.status === "conflict" ? "text-red-700" : dirty ? "text-amber-900" : "text-ink-muted";
  return (
    <p role="status" data-testid="save-status" data-dirty={dirty ? "true" : "false"} className={`max-w-80 truncate text-xs ${tone}`} title={text}>
      {dirty && save.status !== "saving" ? <span aria-hidden className="mr-1">●</span> : null}
      {text}
    </p>
  );
}

export function EditorToolbar({ onSave }: { onSave: () => void }) {
  const store = useEditorStore();
  const kit = useEditor((s) => s.kit);
  const readOnly = useEditor((s) => s.readOnly);
  const settings = useEditor((s) => s.settings);
  const saving = useEditor((s) => s.save.status === "saving");
  const dirty = useEditor(selectDirty);
  const faulty = useEditor(selectFaulty);
  const { canUndo, canRedo } = useHistoryDepth();
  const gridId = useId();
  const unitId = useId();
  const noteId = useId();
  const note = useEditor((s) => s.note);
  const unit = settings.lengthUnit;

  const setUnit = (next: LengthUnit) => {
    store.getState().setSettings({ lengthUnit: next, gridStepMm: GRID_STEPS_MM[next][2]! });
    // Remembered for the person, not the kit; the editor works on even if this does not reach the server.
    api("/api/me/preferences", { method: "PUT", body: { lengthUnit: next } }).catch(() => {});
  };

  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1 border-b border-ink/10 bg-white px-3 py-1.5">
      <div className="mr-auto min-w-0">
        <h1 className="truncate text-base font-semibold leading-tight">{kit.name}</h1>
        <div className="flex items-center gap-2 text-xs text-ink-muted">
          <span data-testid="kit-revision">{kit.scale} · {kit.headRevision ? `revision ${kit.headRevision}` : `version ${kit.version}`}</span>
          {readOnly ? <span data-testid="read-only-badge" className="rounded bg-ink/10 px-1.5 py-0.5 font-medium text-ink">Read only</span> : <SaveStatus />}
        </div>
      </div>
      {readOnly ? null : (
        <div className="flex gap-1" role="group" aria-label="History">
          <Button variant="secondary" onClick={() => undo(store)} disabled={!canUndo} aria-keyshortcuts="Control+Z Meta+Z" title={`Undo (${SHORTCUT_MOD}+Z)`}>Undo</Button>
          <Button variant="secondary" onClick={() => redo(store)} disabled={!canRedo} aria-keyshortcuts="Control+Shift+Z Meta+Shift+Z Control+Y" title={`Redo (${SHORTCUT_MOD}+Shift+Z)`}>Redo</Button>
        </div>
      )}
      {readOnly ? null : (
        <div className="flex items-center gap-1">
          <label htmlFor={gridId} className="text-xs">Grid</label>
          <select id={gridId} data-testid="grid-step" value={String(settings.gridStepMm)} onChange={(e) => store.getState().setSettings({ gridStepMm: Number(e.target.value) })} className="rounded border border-ink/20 bg-white px-1 py-1 text-xs">
            {GRID_STEPS_MM[unit].map((mm) => <option key={mm} value={String(mm)}>{formatLength(mm, unit)}</option>)}
          </select>
        </div>
      )}
      <div className="flex items-center gap-1">
        <label htmlFor={unitId} className="text-xs">Units</label>
        <select id={unitId} data-testid="length-unit" value={unit} onChange={(e) => isLengthUnit(e.target.value) && setUnit(e.target.value)} className="rounded border border-ink/20 bg-white px-1 py-1 text-xs">
          <option value="mm">millimetres</option>
          <option value="in">inches</option>
        </select>
      </div>
      <details className="relative">
        <summary className="cursor-pointer rounded-md border border-ink/20 px-2 py-1 text-xs">Show…</summary>
        <fieldset className="absolute right-0 z-20 mt-1 w-64 rounded-md border border-ink/20 bg-white p-2 shadow-lg">
          <legend className="sr-only">What the views draw</legend>
          {(Object.keys(SHOW_LABELS) as (keyof ShowOptions)[]).map((k) => (
            <label key={k} className="flex items-center gap-2 py-0.5 text-xs">
              <input type="checkbox" checked={settings.show[k]} onChange={(e) => store.getState().setSettings({ show: { [k]: e.target.checked } })} />
              {SHOW_LABELS[k]}
            </label>
          ))}
        </fieldset>
      </details>
      <ExportMenu />
      {readOnly ? null : (
        <div className="flex items-center">
          <label htmlFor={noteId} className="sr-only">Note for the revision this save makes (optional)</label>
          <input
            id={noteId}
            data-testid="revision-note"
            value={note}
            maxLength={500}
            placeholder="Note for this revision (optional)"
            onChange={(e) => store.getState().setNote(e.target.value)}
            onKeyDown={(e) => {
              if (e.key === "Enter" && dirty && !faulty) {
                e.preventDefault();
                onSave();
              }
            }}
            className="w-56 rounded-md border border-ink/20 bg-white px-2 py-1 text-xs placeholder:text-ink-muted"
          />
        </div>
      )}
      {readOnly ? null : (
        <Button
          data-testid="save-layout"
          onClick={onSave}
          busy={saving}
          disabled={!dirty || faulty}
          aria-keyshortcuts="Control+S Meta+S"
          title={faulty ? "Fix the layout's fault before saving" : `Save (${SHORTCUT_MOD}+S)`}
        >
          Save
        </Button>
      )}
    </div>
  );
}
