// One store per mounted editor (made by the provider, never a module singleton), in slices:
//   document   the layout being edited (the only part undo tracks), and what was last saved
//   draft      the layout while a handle is dragged: cheap live readouts, written to the document once on release
//   selection, preview (steer and travel shown), settings (grid, units, what is drawn)
//   live       the figures of the latest analysis the worker returned, and what is wrong with the layout
//   save       the state of the last save
import type { SceneShow } from "@/drawing/scene";
import { temporal } from "zundo";
import { createStore, type StoreApi } from "zustand/vanilla";
import type { Layout } from "@/contracts/layout";
import type { AnalysisResult, NeckTradeoff } from "@/engine";
import type { PartId } from "../document/handles";
import { DEFAULT_GRID_STEP_MM } from "../tools/snapping";
import type { LengthUnit } from "@/figures/length-unit";

export interface KitRef {
  readonly workspaceId: string;
  readonly kitId: string;
  readonly name: string;
  readonly scale: string;
  readonly notes: string;
  readonly version: number;
  readonly updatedByName: string | null;
  readonly updatedAt: string;
  /** The number of the kit's latest revision (each save makes the next). */
  readonly headRevision?: number;
}

/** What is wrong with the layout being shown: a field out of its range or a part that cannot work. */
export interface LayoutFault {
  readonly kind: "invalid" | "impossible";
  readonly message: string;
  /** The part at fault, for marking the drawing (null when no single part is to blame). */
  readonly part: PartId | null;
  /** The handle to mark, when the fault is about a point. */
  readonly handleId: string | null;
  /** The layout field named, for the panel. */
  readonly path: string | null;
}

export interface LiveAnalysis {
  /** The last valid analysis (kept, marked stale, while the layout is impossible). */
  readonly analysis: AnalysisResult | null;
  readonly quality: "coarse" | "full";
  /** True when `analysis` is not of the layout on screen (a fault, or a newer edit still computing). */
  readonly stale: boolean;
  readonly fault: LayoutFault | null;
  /**
   * Steer lock and safety factor over neck diameter, from the last full analysis (null until one is known).
   * Coarse analyses while dragging leave it as it was: it is of the layout before the drag until release.
   */
  readonly tradeoff: NeckTradeoff | null;
  /** Bumped for every result applied: readouts and the bench watch it. */
  readonly seq: number;
}

/** What the views draw besides the parts (the scenes' own choices, src/drawing/scene.ts). */
export type ShowOptions = SceneShow;

export interface EditorSettings {
  readonly gridStepMm: number;
  readonly lengthUnit: LengthUnit;
  readonly show: ShowOptions;
}

export interface Preview {
  /** Steering input shown: rack mm (+ towards +y) or bellcrank degrees (+ counter-clockwise from above). */
  readonly steerInput: number;
  /** Wheel travel shown, mm (+ bump). */
  readonly travelMm: number;
  readonly sweeping: boolean;
}

export type SaveState =
  | { readonly status: "idle" }
  | { readonly status: "saving" }
  | { readonly status: "saved"; readonly at: string }
  | { readonly status: "error"; readonly message: string }
  | { readonly status: "conflict"; readonly currentVersion: number; readonly updatedByName: string | null; readonly updatedAt: string | null };

export interface EditorState {
  readonly kit: KitRef;
  readonly readOnly: boolean;
  readonly layout: Layout;
  /** JSON of the layout as last loaded or saved: the unsaved mark compares against it. */
  readonly savedJson: string;
  readonly draft: Layout | null;
  readonly selectedHandle: string | null;
  readonly preview: Preview;
  readonly settings: EditorSettings;
  readonly live: LiveAnalysis;
  readonly save: SaveState;
  /** The note the next save's revision carries (optional; cleared once saved). */
  readonly note: string;

  /** Writes the document (one undo step; `coalesce` merges repeats of the same edit within a second). */
  commit(next: Layout, options?: { coalesce?: string }): void;
  setDraft(draft: Layout | null): void;
  select(handleId: string | null): void;
  setPreview(preview: Partial<Preview>): void;
  setSettings(settings: Partial<Omit<EditorSettings, "show">> & { show?: Partial<ShowOptions> }): void;
  setLive(live: Partial<Omit<LiveAnalysis, "seq">>): void;
  setSave(save: SaveState): void;
  setNote(note: string): void;
  /** After a successful save: the kit's new version, and this layout as the saved one. */
  markSaved(kit: Partial<KitRef> & { version: number }, layout: Layout): void;
  /** Takes the server's copy (someone else's save): an undoable step, so my version stays reachable. */
  takeServerCopy(kit: Partial<KitRef> & { version: number }, layout: Layout): void;
}

export type EditorStore = StoreApi<EditorState> & { temporal: StoreApi<import("zundo").TemporalState<{ layout: Layout }>> };

export interface EditorInit {
  readonly kit: KitRef;
  readonly layout: Layout;
  readonly readOnly: boolean;
  readonly lengthUnit: LengthUnit;
  /** The analysis the server made with the page, so figures show before the worker starts. */
  readonly analysis: AnalysisResult | null;
  /** The neck trade-off of the same layout, when the page has one (else the worker computes it). */
  readonly tradeoff?: NeckTradeoff | null;
  readonly fault?: LayoutFault | null;
  readonly gridStepMm?: number;
  /** The kit's saved layout when the document opens as something else (a design search's layout): unsaved from the start. */
  readonly savedLayout?: Layout;
  /** The note the first save carries (a search's layout names the search). */
  readonly note?: string;
}

const COALESCE_MS = 1000;

export function createEditorStore(init: EditorInit): EditorStore {
  let lastCoalesce: { key: string; at: number } | null = null;
  const store = createStore<EditorState>()(
    temporal(
      (set, get) => ({
        kit: init.kit,
        readOnly: init.readOnly,
        layout: init.layout,
        savedJson: JSON.stringify(init.savedLayout ?? init.layout),
        draft: null,
        selectedHandle: null,
        preview: { steerInput: 0, travelMm: 0, sweeping: false },
        settings: {
          gridStepMm: init.gridStepMm ?? DEFAULT_GRID_STEP_MM,
          lengthUnit: init.lengthUnit,
          show: { kingpinAxis: true, instantCentre: true, rollCentre: true, ackermann: true, dimensions: true },
        },
        live: { analysis: init.analysis, quality: "full", stale: init.analysis === null, fault: init.fault ?? null, tradeoff: init.tradeoff ?? null, seq: 0 },
        save: { status: "idle" },
        note: init.note ?? "",

        commit(next, options) {
          if (get().readOnly || next === get().layout) {
            if (get().draft) set({ draft: null });
            return;
          }
          const now = Date.now();
          const key = options?.coalesce;
          const merge = key !== undefined && lastCoalesce?.key === key && now - lastCoalesce.at < COALESCE_MS;
          lastCoalesce = key ? { key, at: now } : null;
          if (merge) {
            // The step before the first of these edits is already in the history: change the document quietly.
            const t = (store as EditorStore).temporal.getState();
            t.pause();
            set({ layout: next, draft: null });
            t.resume();
          } else {
            set({ layout: next, draft: null });
          }
        },
        setDraft(draft) {
          if (get().readOnly && draft) return;
          set({ draft });
        },
        select(handleId) {
          set({ selectedHandle: handleId });
        },
        setPreview(preview) {
          set({ preview: { ...get().preview, ...preview } });
        },
        setSettings({ show, ...rest }) {
          const s = get().settings;
          set({ settings: { ...s, ...rest, show: { ...s.show, ...show } } });
        },
        setLive(live) {
          set({ live: { ...get().live, ...live, seq: get().live.seq + 1 } });
        },
        setSave(save) {
          set({ save });
        },
        setNote(note) {
          set({ note });
        },
        markSaved(kit, layout) {
          set({ kit: { ...get().kit, ...kit }, savedJson: JSON.stringify(layout), save: { status: "saved", at: new Date().toISOString() }, note: "" });
        },
        takeServerCopy(kit, layout) {
          lastCoalesce = null;
          set({ layout, draft: null, kit: { ...get().kit, ...kit }, savedJson: JSON.stringify(layout), save: { status: "idle" } });
        },
      }),
      {
        partialize: (s) => ({ layout: s.layout }),
        equality: (a, b) => a.layout === b.layout,
        limit: 200,
      },
    ),
  );
  return store as EditorStore;
}

/** The layout on screen: the draft while dragging, else the document. */
export const selectShownLayout = (s: EditorState): Layout => s.draft ?? s.layout;

/** True when the document differs from what was last loaded or saved. */
export const selectDirty = (s: EditorState): boolean => JSON.stringify(s.layout) !== s.savedJson;

/** True when the document is the thing to fault: the server would refuse it, so Save waits for a fix. */
export const selectFaulty = (s: EditorState): boolean => s.live.fault !== null && s.draft === null;

/** Whether Save (button or shortcut) has anything it may do now. */
export const selectCanSave = (s: EditorState): boolean => !s.readOnly && selectDirty(s) && !selectFaulty(s);

export function undo(store: EditorStore): void {
  if (store.getState().draft) return;
  store.temporal.getState().undo();
}

export function redo(store: EditorStore): void {
  if (store.getState().draft) return;
  store.temporal.getState().redo();
}
