import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { TARNWICK_10_BASE, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import { nudgeHandle, setNeckDiameter } from "@/editor/commands/edit-commands";
import { redo, selectDirty, selectShownLayout, undo } from "@/editor/store/editor-store";
import { createHandleDragTool } from "@/editor/tools/handle-drag-tool";
import { makeStore } from "./editor-fixtures";

const at = (u: number, v: number, sx: number, sy: number, free = false) => ({ plane: [u, v] as const, screen: [sx, sy] as const, free });

describe("the editor store", () => {
  it("one commit is one undo step; redo brings it back; the unsaved mark follows", () => {
    const store = makeStore();
    expect(selectDirty(store.getState())).toBe(false);
    store.getState().commit(setNeckDiameter(TARNWICK_10_BASE, 4));
    expect(store.getState().layout.drive.neckDiameterMm).toBe(4);
    expect(selectDirty(store.getState())).toBe(true);
    undo(store);
    expect(store.getState().layout).toBe(TARNWICK_10_BASE);
    expect(selectDirty(store.getState())).toBe(false);
    redo(store);
    expect(store.getState().layout.drive.neckDiameterMm).toBe(4);
  });

  it("drafts are not history: many draft updates and one commit make one step", () => {
    const store = makeStore();
    for (let i = 1; i <= 30; i++) store.getState().setDraft(setNeckDiameter(TARNWICK_10_BASE, 5 - i * 0.02));
    expect(selectShownLayout(store.getState()).drive.neckDiameterMm).toBe(4.4);
    expect(store.getState().layout).toBe(TARNWICK_10_BASE);
    expect(store.temporal.getState().pastStates).toHaveLength(0);
    store.getState().commit(store.getState().draft!);
    expect(store.getState().draft).toBeNull();
    expect(store.temporal.getState().pastStates).toHaveLength(1);
    undo(store);
    expect(store.getState().layout.drive.neckDiameterMm).toBe(5);
  });

  describe("repeated nudges of one handle", () => {
    beforeEach(() => vi.useFakeTimers());
    afterEach(() => vi.useRealTimers());

    it("merge into one step within a second, and start a new one after", () => {
      const store = makeStore();
      const nudge = () => store.getState().commit(nudgeHandle(store.getState().layout, "front:lowerOuter", 0.5, 0), { coalesce: "nudge:front:lowerOuter" });
      nudge();
      vi.advanceTimersByTime(200);
      nudge();
      vi.advanceTimersByTime(200);
      nudge();
      expect(store.getState().layout.frontView.lowerOuter.y).toBe(111.5);
      expect(store.temporal.getState().pastStates).toHaveLength(1);
      vi.advanceTimersByTime(1500);
      nudge();
      expect(store.temporal.getState().pastStates).toHaveLength(2);
      undo(store);
      expect(store.getState().layout.frontView.lowerOuter.y).toBe(111.5);
      undo(store);
      expect(store.getState().layout.frontView.lowerOuter.y).toBe(110);
    });
  });

  it("a viewer's store takes no edits", () => {
    const store = makeStore({ readOnly: true });
    store.getState().commit(TARNWICK_10_THIN_NECK);
    store.getState().setDraft(TARNWICK_10_THIN_NECK);
    expect(store.getState().layout).toBe(TARNWICK_10_BASE);
    expect(store.getState().draft).toBeNull();
  });

  it("taking the server's copy is undoable, so my edit is still reachable", () => {
    const store = makeStore();
    store.getState().commit(setNeckDiameter(TARNWICK_10_BASE, 4.5));
    store.getState().takeServerCopy({ version: 4, updatedByName: "Edda" }, TARNWICK_10_THIN_NECK);
    expect(store.getState().kit.version).toBe(4);
    expect(selectDirty(store.getState())).toBe(false);
    undo(store);
    expect(store.getState().layout.drive.neckDiameterMm).toBe(4.5);
    expect(selectDirty(store.getState())).toBe(true);
  });
});

describe("the handle drag tool (scripted pointer events)", () => {
  it("drags with snapping to the grid step, keeps the grab offset, and commits one step on release", () => {
    const store = makeStore();
    const tool = createHandleDragTool(store);
    // Lower ball joint at (110, 23); pressed 0.2 mm right of its centre.
    tool.pointerDown("front:lowerOuter", at(110.2, 23, 400, 300));
    expect(tool.state().kind).toBe("pointing");
    expect(store.getState().selectedHandle).toBe("front:lowerOuter");
    tool.pointerMove(at(111.9, 21.1, 410, 310));
    expect(tool.state().kind).toBe("dragging");
    // 111.9 − 0.2 = 111.7 → 111.5; 21.1 → 21.0 on the 0.5 mm grid.
    expect(store.getState().draft!.frontView.lowerOuter).toEqual({ y: 111.5, z: 21 });
    tool.pointerMove(at(112.6, 20.2, 420, 320));
    expect(store.getState().draft!.frontView.lowerOuter).toEqual({ y: 112.5, z: 20 });
    expect(store.getState().layout).toBe(TARNWICK_10_BASE);
    tool.pointerUp();
    expect(store.getState().layout.frontView.lowerOuter).toEqual({ y: 112.5, z: 20 });
    expect(store.getState().draft).toBeNull();
    expect(store.temporal.getState().pastStates).toHaveLength(1);
    expect(tool.state().kind).toBe("idle");
  });

  it("drags freely with the modifier held", () => {
    const store = makeStore();
    const tool = createHandleDragTool(store);
    tool.pointerDown("front:lowerOuter", at(110, 23, 400, 300));
    tool.pointerMove(at(111.37, 22.61, 420, 310, true));
    expect(store.getState().draft!.frontView.lowerOuter.y).toBeCloseTo(111.37, 10);
    expect(store.getState().draft!.frontView.lowerOuter.z).toBeCloseTo(22.61, 10);
  });

  it("a press that does not travel past the slop only selects", () => {
    const store = makeStore();
    const tool = createHandleDragTool(store);
    tool.pointerDown("top:rackEnd", at(35, 20, 200, 200));
    tool.pointerMove(at(36, 20, 202, 201));
    tool.pointerUp();
    expect(store.getState().selectedHandle).toBe("top:rackEnd");
    expect(store.getState().layout).toBe(TARNWICK_10_BASE);
    expect(store.temporal.getState().pastStates).toHaveLength(0);
  });

  it("cancel drops the drag and leaves the document", () => {
    const store = makeStore();
    const tool = createHandleDragTool(store);
    tool.pointerDown("front:wheelCentre", at(122, 42, 0, 0));
    tool.pointerMove(at(130, 42, 50, 0));
    expect(store.getState().draft).not.toBeNull();
    tool.cancel();
    expect(store.getState().draft).toBeNull();
    expect(store.getState().layout).toBe(TARNWICK_10_BASE);
  });

  it("a viewer can select a handle but not move it", () => {
    const store = makeStore({ readOnly: true });
    const tool = createHandleDragTool(store);
    tool.pointerDown("front:wheelCentre", at(122, 42, 0, 0));
    tool.pointerMove(at(130, 42, 50, 0));
    tool.pointerUp();
    expect(store.getState().selectedHandle).toBe("front:wheelCentre");
    expect(store.getState().layout).toBe(TARNWICK_10_BASE);
  });
});
