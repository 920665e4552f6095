"use client";
// The editor's keys: Ctrl/Cmd+Z undo, Shift+Ctrl/Cmd+Z or Ctrl+Y redo, Ctrl/Cmd+S save. In a text field
// undo stays the field's own (the browser undoes typing there).
import { useEffect } from "react";
import { redo, undo, type EditorStore } from "../store/editor-store";

function inTextField(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable) return true;
  if (target instanceof HTMLTextAreaElement || target instanceof HTMLSelectElement) return true;
  return target instanceof HTMLInputElement && !["button", "checkbox", "radio", "range", "submit"].includes(target.type);
}

export function useEditorShortcuts(store: EditorStore, onSave: () => void): void {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const mod = e.ctrlKey || e.metaKey;
      if (!mod || e.altKey) return;
      const key = e.key.toLowerCase();
      if (key === "s") {
        e.preventDefault(); // never the browser's "save page"
        if (e.target instanceof HTMLElement && inTextField(e.target)) {
          // Leaving the field commits it (the panel checks it asynchronously): save once that has run.
          e.target.blur();
          setTimeout(onSave, 0);
        } else onSave();
        return;
      }
      if (inTextField(e.target)) return;
      if (key === "z" && !e.shiftKey) {
        e.preventDefault();
        undo(store);
      } else if ((key === "z" && e.shiftKey) || (key === "y" && !e.shiftKey)) {
        e.preventDefault();
        redo(store);
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [store, onSave]);
}
