// Dragging a handle, as a small state machine: idle → pointing (pressed on a handle) → dragging (moved
// past the slop) → idle. While dragging only the draft changes; releasing writes the document once (one
// undo step). The canvas translates pointer events into these calls; tests drive them directly.
import type { Layout } from "@/contracts/layout";
import { moveHandle } from "../commands/edit-commands";
import { handleById, handlePlanePoint } from "../document/handles";
import type { EditorStore } from "../store/editor-store";
import type { PlanePoint, ScreenPoint } from "@/drawing/view-transform";
import { snapToStep } from "./snapping";

/** Screen distance a press must travel before it becomes a drag, px. */
export const DRAG_SLOP_PX = 3;

export interface PointerInput {
  readonly plane: PlanePoint;
  readonly screen: ScreenPoint;
  /** The free-drag modifier (Alt, or Ctrl/Cmd) is held: no snapping. */
  readonly free: boolean;
}

export type DragToolState =
  | { readonly kind: "idle" }
  | { readonly kind: "pointing" | "dragging"; readonly handleId: string; readonly down: ScreenPoint; readonly grab: PlanePoint; readonly base: Layout };

export interface HandleDragTool {
  readonly state: () => DragToolState;
  pointerDown(handleId: string, p: PointerInput): void;
  pointerMove(p: PointerInput): void;
  pointerUp(): void;
  /** Escape, or the pointer lost: the drag is dropped and the document stays as it was. */
  cancel(): void;
}

export function createHandleDragTool(store: EditorStore): HandleDragTool {
  let state: DragToolState = { kind: "idle" };

  const target = (s: Extract<DragToolState, { kind: "pointing" | "dragging" }>, p: PointerInput): Layout => {
    const u = p.plane[0] - s.grab[0];
    const v = p.plane[1] - s.grab[1];
    const step = store.getState().settings.gridStepMm;
    return p.free ? moveHandle(s.base, s.handleId, u, v) : moveHandle(s.base, s.handleId, snapToStep(u, step), snapToStep(v, step));
  };

  return {
    state: () => state,
    pointerDown(handleId, p) {
      const h = handleById(handleId);
      const st = store.getState();
      st.select(handleId);
      if (!h || st.readOnly) return;
      const [hu, hv] = handlePlanePoint(st.layout, h);
      // Keep the offset between the pointer and the handle's centre, so a grab off-centre does not jump.
      state = { kind: "pointing", handleId, down: p.screen, grab: [p.plane[0] - hu, p.plane[1] - hv], base: st.layout };
    },
    pointerMove(p) {
      if (state.kind === "idle") return;
      if (state.kind === "pointing") {
        if (Math.hypot(p.screen[0] - state.down[0], p.screen[1] - state.down[1]) < DRAG_SLOP_PX) return;
        state = { ...state, kind: "dragging" };
      }
      store.getState().setDraft(target(state, p));
    },
    pointerUp() {
      const s = store.getState();
      if (state.kind === "dragging" && s.draft) s.commit(s.draft);
      else if (s.draft) s.setDraft(null);
      state = { kind: "idle" };
    },
    cancel() {
      store.getState().setDraft(null);
      state = { kind: "idle" };
    },
  };
}
