"use client";
// One editor store per mounted editor, handed down by context and read with narrow selectors.
import { createContext, useContext, useEffect, useState, type ReactNode } from "react";
import { useStore } from "zustand";
import { createEditorStore, type EditorInit, type EditorState, type EditorStore } from "./editor-store";

const EditorStoreContext = createContext<EditorStore | null>(null);

export function EditorProvider({ init, children }: { init: EditorInit; children: ReactNode }) {
  const [store] = useState(() => createEditorStore(init));
  return <EditorStoreContext.Provider value={store}>{children}</EditorStoreContext.Provider>;
}

export function useEditorStore(): EditorStore {
  const store = useContext(EditorStoreContext);
  if (!store) throw new Error("useEditorStore must be used inside <EditorProvider>");
  return store;
}

export function useEditor<T>(selector: (s: EditorState) => T): T {
  return useStore(useEditorStore(), selector);
}

/** Whether undo and redo have anything to do (for the toolbar buttons). */
export function useHistoryDepth(): { canUndo: boolean; canRedo: boolean } {
  const store = useEditorStore();
  const canUndo = useStore(store.temporal, (t) => t.pastStates.length > 0);
  const canRedo = useStore(store.temporal, (t) => t.futureStates.length > 0);
  return { canUndo, canRedo };
}

/**
 * Like useEditor, but while a handle is dragged the value holds what it was when the drag began, and
 * follows again on release. For the costly readers (the plots): a re-render of every chart per pointer
 * move takes longer than a frame. `selector` must be stable (defined at module level).
 */
export function useEditorHeldWhileDragging<T>(selector: (s: EditorState) => T): T {
  const store = useEditorStore();
  const [value, setValue] = useState(() => selector(store.getState()));
  useEffect(() => {
    const follow = (s: EditorState) => {
      if (s.draft === null) setValue(() => selector(s));
    };
    follow(store.getState());
    return store.subscribe(follow);
  }, [store, selector]);
  return value;
}
